ALTER TABLE `batch_lot_uses` ADD `measured_assay_used` double;--> statement-breakpoint
ALTER TABLE `material_lots` ADD `version` int DEFAULT 1 NOT NULL;--> statement-breakpoint
-- Batches released before lots could be corrected used the assay their lot still carries.
UPDATE `batch_lot_uses` u JOIN `material_lots` l ON l.`id` = u.`lot_id` SET u.`measured_assay_used` = l.`measured_assay` WHERE u.`quantity_used` IS NOT NULL;