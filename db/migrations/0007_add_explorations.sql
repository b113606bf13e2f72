CREATE TABLE `explorations` (
	`id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`formulation_id` varchar(36) NOT NULL,
	`revision_id` varchar(36) NOT NULL,
	`name` varchar(200) NOT NULL,
	`grid` json NOT NULL,
	`outputs` json NOT NULL,
	`search` json,
	`candidates` json,
	`point_count` int NOT NULL,
	`created_by` varchar(36),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `explorations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `explorations` ADD CONSTRAINT `explorations_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `explorations` ADD CONSTRAINT `explorations_formulation_id_formulations_id_fk` FOREIGN KEY (`formulation_id`) REFERENCES `formulations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `explorations` ADD CONSTRAINT `explorations_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `explorations` ADD CONSTRAINT `explorations_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `explorations_team_formulation_idx` ON `explorations` (`team_id`,`formulation_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `explorations_revision_idx` ON `explorations` (`revision_id`,`created_at`);