ALTER TABLE `user` ADD `fit_decider` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `order` MODIFY COLUMN `status` enum('awaiting_payment','paid','cutting','sewn','finished','shipped','delivered','cancelled','refunded','awaiting_return','altering') NOT NULL DEFAULT 'awaiting_payment';--> statement-breakpoint
ALTER TABLE `order_event` MODIFY COLUMN `from_status` enum('awaiting_payment','paid','cutting','sewn','finished','shipped','delivered','cancelled','refunded','awaiting_return','altering');--> statement-breakpoint
ALTER TABLE `order_event` MODIFY COLUMN `to_status` enum('awaiting_payment','paid','cutting','sewn','finished','shipped','delivered','cancelled','refunded','awaiting_return','altering');--> statement-breakpoint
ALTER TABLE `order` ADD `kind` enum('order','remake') DEFAULT 'order' NOT NULL;--> statement-breakpoint
ALTER TABLE `order` ADD `remake_of_id` int;--> statement-breakpoint
CREATE INDEX `order_remake_of_idx` ON `order` (`remake_of_id`);--> statement-breakpoint
CREATE TABLE `fit_report` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`order_line_id` int NOT NULL,
	`answers` json NOT NULL,
	`marks` json NOT NULL,
	`note` text,
	`units` enum('cm','in') NOT NULL DEFAULT 'cm',
	`wish` enum('alteration','remake') NOT NULL,
	`status` enum('new','waiting','decided') NOT NULL DEFAULT 'new',
	`decision` enum('alteration','remake','decline'),
	`reason` text,
	`corrections` json,
	`decided_by` varchar(255),
	`decided_at` timestamp(3),
	`remake_order_id` int,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `fit_report_id` PRIMARY KEY(`id`),
	CONSTRAINT `fit_report_order_line_id_unique` UNIQUE(`order_line_id`)
);--> statement-breakpoint
CREATE TABLE `fit_photo` (
	`id` int AUTO_INCREMENT NOT NULL,
	`public_id` varchar(43) NOT NULL,
	`report_id` int NOT NULL,
	`storage_key` varchar(255) NOT NULL,
	`mime` varchar(80) NOT NULL,
	`bytes` int NOT NULL,
	`width` int NOT NULL,
	`height` int NOT NULL,
	`consent_at` timestamp(3) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `fit_photo_id` PRIMARY KEY(`id`),
	CONSTRAINT `fit_photo_public_id_unique` UNIQUE(`public_id`),
	CONSTRAINT `fit_photo_storage_key_unique` UNIQUE(`storage_key`)
);--> statement-breakpoint
CREATE TABLE `measure_card_change` (
	`id` int AUTO_INCREMENT NOT NULL,
	`profile_id` int,
	`user_id` varchar(255),
	`field` varchar(40) NOT NULL,
	`from_cm` decimal(6,1),
	`to_cm` decimal(6,1),
	`reason` varchar(500) NOT NULL,
	`report_id` int,
	`order_id` int,
	`changed_by` varchar(255),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `measure_card_change_id` PRIMARY KEY(`id`)
);--> statement-breakpoint
ALTER TABLE `fit_report` ADD CONSTRAINT `fit_report_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fit_report` ADD CONSTRAINT `fit_report_order_line_id_order_line_id_fk` FOREIGN KEY (`order_line_id`) REFERENCES `order_line`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fit_report` ADD CONSTRAINT `fit_report_decided_by_user_id_fk` FOREIGN KEY (`decided_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fit_photo` ADD CONSTRAINT `fit_photo_report_id_fit_report_id_fk` FOREIGN KEY (`report_id`) REFERENCES `fit_report`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measure_card_change` ADD CONSTRAINT `measure_card_change_profile_id_measurement_profile_id_fk` FOREIGN KEY (`profile_id`) REFERENCES `measurement_profile`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measure_card_change` ADD CONSTRAINT `measure_card_change_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measure_card_change` ADD CONSTRAINT `measure_card_change_report_id_fit_report_id_fk` FOREIGN KEY (`report_id`) REFERENCES `fit_report`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measure_card_change` ADD CONSTRAINT `measure_card_change_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measure_card_change` ADD CONSTRAINT `measure_card_change_changed_by_user_id_fk` FOREIGN KEY (`changed_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `fit_report_status_idx` ON `fit_report` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `fit_report_order_idx` ON `fit_report` (`order_id`);--> statement-breakpoint
CREATE INDEX `fit_photo_report_idx` ON `fit_photo` (`report_id`);--> statement-breakpoint
CREATE INDEX `fit_photo_created_idx` ON `fit_photo` (`created_at`);--> statement-breakpoint
CREATE INDEX `measure_card_change_profile_idx` ON `measure_card_change` (`profile_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `measure_card_change_user_idx` ON `measure_card_change` (`user_id`);
