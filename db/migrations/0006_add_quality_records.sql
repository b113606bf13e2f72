CREATE TABLE `batch_dispositions` (
	`batch_id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`disposition` enum('released','rejected','released_under_deviation') NOT NULL,
	`justification` text,
	`acknowledged_deviations` json,
	`disposed_by` varchar(36),
	`disposed_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `batch_dispositions_batch_id` PRIMARY KEY(`batch_id`)
);
--> statement-breakpoint
CREATE TABLE `batch_lot_uses` (
	`id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`batch_id` varchar(36) NOT NULL,
	`line_index` int NOT NULL,
	`lot_id` varchar(36) NOT NULL,
	`quantity_used` double,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `batch_lot_uses_id` PRIMARY KEY(`id`),
	CONSTRAINT `lot_uses_batch_line_uq` UNIQUE(`batch_id`,`line_index`)
);
--> statement-breakpoint
CREATE TABLE `batch_results` (
	`id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`batch_id` varchar(36) NOT NULL,
	`spec_id` varchar(36) NOT NULL,
	`value_number` double,
	`value_text` varchar(500),
	`out_of_spec` boolean NOT NULL DEFAULT false,
	`instrument` varchar(200),
	`entered_by` varchar(36),
	`entered_at` timestamp(3) NOT NULL DEFAULT (now()),
	`acknowledged_by` varchar(36),
	`acknowledged_at` timestamp(3),
	`acknowledgement` text,
	CONSTRAINT `batch_results_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `material_lots` (
	`id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`material_id` varchar(36) NOT NULL,
	`supplier` varchar(200) NOT NULL,
	`supplier_lot` varchar(100) NOT NULL,
	`unit` enum('g','kg','mL','L') NOT NULL,
	`quantity_received` double NOT NULL,
	`quantity_on_hand` double NOT NULL,
	`received_on` date NOT NULL,
	`expires_on` date,
	`measured_assay` double,
	`notes` text,
	`received_by` varchar(36),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `material_lots_id` PRIMARY KEY(`id`),
	CONSTRAINT `lots_team_material_lot_uq` UNIQUE(`team_id`,`material_id`,`supplier_lot`)
);
--> statement-breakpoint
ALTER TABLE `revisions` ADD `specifications` json;--> statement-breakpoint
ALTER TABLE `batch_dispositions` ADD CONSTRAINT `batch_dispositions_batch_id_batch_records_id_fk` FOREIGN KEY (`batch_id`) REFERENCES `batch_records`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_dispositions` ADD CONSTRAINT `batch_dispositions_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_dispositions` ADD CONSTRAINT `batch_dispositions_disposed_by_user_id_fk` FOREIGN KEY (`disposed_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_lot_uses` ADD CONSTRAINT `batch_lot_uses_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_lot_uses` ADD CONSTRAINT `batch_lot_uses_batch_id_batch_records_id_fk` FOREIGN KEY (`batch_id`) REFERENCES `batch_records`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_lot_uses` ADD CONSTRAINT `batch_lot_uses_lot_id_material_lots_id_fk` FOREIGN KEY (`lot_id`) REFERENCES `material_lots`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_results` ADD CONSTRAINT `batch_results_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_results` ADD CONSTRAINT `batch_results_batch_id_batch_records_id_fk` FOREIGN KEY (`batch_id`) REFERENCES `batch_records`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_results` ADD CONSTRAINT `batch_results_entered_by_user_id_fk` FOREIGN KEY (`entered_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `batch_results` ADD CONSTRAINT `batch_results_acknowledged_by_user_id_fk` FOREIGN KEY (`acknowledged_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `material_lots` ADD CONSTRAINT `material_lots_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `material_lots` ADD CONSTRAINT `material_lots_material_id_materials_id_fk` FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `material_lots` ADD CONSTRAINT `material_lots_received_by_user_id_fk` FOREIGN KEY (`received_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `dispositions_team_idx` ON `batch_dispositions` (`team_id`,`disposed_at`);--> statement-breakpoint
CREATE INDEX `lot_uses_lot_idx` ON `batch_lot_uses` (`team_id`,`lot_id`);--> statement-breakpoint
CREATE INDEX `results_batch_idx` ON `batch_results` (`team_id`,`batch_id`);--> statement-breakpoint
CREATE INDEX `results_spec_idx` ON `batch_results` (`team_id`,`spec_id`);--> statement-breakpoint
CREATE INDEX `lots_team_material_expiry_idx` ON `material_lots` (`team_id`,`material_id`,`expires_on`);