CREATE TABLE `lot_adjustments` (
	`id` varchar(36) NOT NULL,
	`team_id` varchar(36) NOT NULL,
	`lot_id` varchar(36) NOT NULL,
	`quantity_before` double NOT NULL,
	`quantity_after` double NOT NULL,
	`lot_version` int NOT NULL,
	`reason` enum('recount','damaged','disposed','sample','other') NOT NULL,
	`note` text,
	`adjusted_by` varchar(36),
	`adjusted_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `lot_adjustments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `lot_adjustments` ADD CONSTRAINT `lot_adjustments_team_id_organization_id_fk` FOREIGN KEY (`team_id`) REFERENCES `organization`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lot_adjustments` ADD CONSTRAINT `lot_adjustments_lot_id_material_lots_id_fk` FOREIGN KEY (`lot_id`) REFERENCES `material_lots`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lot_adjustments` ADD CONSTRAINT `lot_adjustments_adjusted_by_user_id_fk` FOREIGN KEY (`adjusted_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `lot_adjustments_lot_idx` ON `lot_adjustments` (`team_id`,`lot_id`,`lot_version`);