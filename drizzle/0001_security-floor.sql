CREATE TABLE `rate_counter` (
	`key` varchar(191) NOT NULL,
	`hits` int NOT NULL,
	`window_start` timestamp(3) NOT NULL,
	CONSTRAINT `rate_counter_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `order_event` MODIFY COLUMN `kind` enum('stage','note','refund','mail','payment') NOT NULL DEFAULT 'stage';--> statement-breakpoint
ALTER TABLE `order` ADD `checkout_key` varchar(64);--> statement-breakpoint
ALTER TABLE `user` ADD `session_version` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `order` ADD CONSTRAINT `order_checkout_key_unique` UNIQUE(`checkout_key`);--> statement-breakpoint
ALTER TABLE `user` MODIFY COLUMN `email` varchar(255) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin;--> statement-breakpoint
ALTER TABLE `verificationToken` MODIFY COLUMN `identifier` varchar(255) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL;
