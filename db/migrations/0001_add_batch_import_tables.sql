CREATE TABLE `batch_settings` (
	`team_id` varchar(36) NOT NULL,
	`tolerance_fraction` double NOT NULL,
	`balance_resolution_grams` double NOT NULL,
	`updated_by` varchar(36),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `batch_settings_team_id` PRIMARY KEY(`team_id`)
);
--> statement-breakpoint
CREATE TABLE `import_previews` (
	`id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`user_id` varchar(36),
	`kind` enum('formulation','materials') NOT NULL,
	`file_name` varchar(255) NOT NULL,
	`state` enum('ready','confirmed') NOT NULL DEFAULT 'ready',
	`preview` json NOT NULL,
	`outcome` json,
	`expires_at` timestamp(3) NOT NULL,
	`confirmed_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `import_previews_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `attachments` ADD `kind` varchar(16) DEFAULT 'other' NOT NULL;--> statement-breakpoint
ALTER TABLE `batch_records` ADD `tolerance_fraction` double DEFAULT 0.01 NOT NULL;--> statement-breakpoint
ALTER TABLE `batch_records` ADD `balance_resolution_grams` double DEFAULT 0.01 NOT NULL;--> statement-breakpoint
ALTER TABLE `batch_records` ADD `closed_by` varchar(36);--> statement-breakpoint
ALTER TABLE `batch_settings` ADD CONSTRAINT `batch_settings_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_settings` ADD CONSTRAINT `batch_settings_updated_by_user_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `import_previews` ADD CONSTRAINT `import_previews_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `import_previews` ADD CONSTRAINT `import_previews_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `import_previews_team_idx` ON `import_previews` (`team_id`,`created_at`);--> statement-breakpoint
ALTER TABLE `batch_records` ADD CONSTRAINT `batch_records_closed_by_user_id_fk` FOREIGN KEY (`closed_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;