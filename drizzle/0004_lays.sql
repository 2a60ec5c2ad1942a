CREATE TABLE `combined_lay` (
	`id` int AUTO_INCREMENT NOT NULL,
	`fabric_id` int NOT NULL,
	`status` enum('open','cut') NOT NULL DEFAULT 'open',
	`length_cm` decimal(7,1) NOT NULL,
	`lay_cm` decimal(7,1) NOT NULL,
	`saved_cm` decimal(7,1) NOT NULL,
	`utilisation` decimal(5,4) NOT NULL,
	`layout` json NOT NULL,
	`lines` json NOT NULL,
	`created_by` varchar(255),
	`created_by_label` varchar(120) NOT NULL,
	`cut_by` varchar(255),
	`cut_by_label` varchar(120),
	`cut_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `combined_lay_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `combined_lay_order` (
	`lay_id` int NOT NULL,
	`order_id` int NOT NULL,
	CONSTRAINT `combined_lay_order_lay_id_order_id_pk` PRIMARY KEY(`lay_id`,`order_id`)
);
--> statement-breakpoint
ALTER TABLE `fabric` ADD `shrinkage_across_pct` decimal(4,1);--> statement-breakpoint
ALTER TABLE `order_line` ADD `cutter_lay` json;--> statement-breakpoint
ALTER TABLE `combined_lay` ADD CONSTRAINT `combined_lay_fabric_id_fabric_id_fk` FOREIGN KEY (`fabric_id`) REFERENCES `fabric`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `combined_lay` ADD CONSTRAINT `combined_lay_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `combined_lay` ADD CONSTRAINT `combined_lay_cut_by_user_id_fk` FOREIGN KEY (`cut_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `combined_lay_order` ADD CONSTRAINT `combined_lay_order_lay_id_combined_lay_id_fk` FOREIGN KEY (`lay_id`) REFERENCES `combined_lay`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `combined_lay_order` ADD CONSTRAINT `combined_lay_order_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `combined_lay_fabric_idx` ON `combined_lay` (`fabric_id`,`status`);--> statement-breakpoint
CREATE INDEX `combined_lay_order_order_idx` ON `combined_lay_order` (`order_id`);
