CREATE TABLE `team_settings` (
	`team_id` varchar(36) NOT NULL,
	`currency` varchar(3) NOT NULL,
	`updated_by` varchar(36),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `team_settings_team_id` PRIMARY KEY(`team_id`)
);
--> statement-breakpoint
ALTER TABLE `team_settings` ADD CONSTRAINT `team_settings_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `team_settings` ADD CONSTRAINT `team_settings_updated_by_user_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;