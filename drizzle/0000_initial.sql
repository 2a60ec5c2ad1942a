CREATE TABLE `account` (
	`userId` varchar(255) NOT NULL,
	`type` varchar(255) NOT NULL,
	`provider` varchar(255) NOT NULL,
	`providerAccountId` varchar(255) NOT NULL,
	`refresh_token` varchar(255),
	`access_token` varchar(255),
	`expires_at` int,
	`token_type` varchar(255),
	`scope` varchar(255),
	`id_token` varchar(2048),
	`session_state` varchar(255),
	CONSTRAINT `account_provider_providerAccountId_pk` PRIMARY KEY(`provider`,`providerAccountId`)
);
--> statement-breakpoint
CREATE TABLE `fabric` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`name` varchar(120) NOT NULL,
	`colour` varchar(60) NOT NULL,
	`swatch_hex` varchar(7) NOT NULL,
	`fibre_content` varchar(255) NOT NULL,
	`care_text` text NOT NULL,
	`width_cm` decimal(5,1) NOT NULL,
	`price_per_metre` int NOT NULL,
	`stock_cm` decimal(8,1) NOT NULL,
	`nap` boolean NOT NULL DEFAULT false,
	`stretch` boolean NOT NULL DEFAULT false,
	`shrinkage_pct` decimal(4,1) NOT NULL DEFAULT 0,
	`image_upload_id` int,
	`retired_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `fabric_id` PRIMARY KEY(`id`),
	CONSTRAINT `fabric_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `house_rules` (
	`id` int AUTO_INCREMENT NOT NULL,
	`rules` json NOT NULL,
	`note` varchar(255) NOT NULL DEFAULT '',
	`created_by` varchar(255),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `house_rules_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `measurement_profile` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`name` varchar(80) NOT NULL,
	`waist_cm` decimal(5,1) NOT NULL,
	`hip_cm` decimal(5,1) NOT NULL,
	`length_cm` decimal(5,1) NOT NULL,
	`waist_to_hip_cm` decimal(5,1),
	`units` enum('cm','in') NOT NULL DEFAULT 'cm',
	`consent_at` timestamp(3) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `measurement_profile_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `order_event` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`actor_id` varchar(255),
	`actor_label` varchar(120) NOT NULL,
	`kind` enum('stage','note','refund','mail') NOT NULL DEFAULT 'stage',
	`from_status` enum('awaiting_payment','paid','cutting','sewn','finished','shipped','delivered','cancelled','refunded'),
	`to_status` enum('awaiting_payment','paid','cutting','sewn','finished','shipped','delivered','cancelled','refunded'),
	`note` text,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `order_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `order_line` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`style_id` int NOT NULL,
	`fabric_id` int NOT NULL,
	`options` json NOT NULL,
	`measurements` json NOT NULL,
	`figures` json NOT NULL,
	`fabric_cm` decimal(6,1) NOT NULL,
	`pricing` json NOT NULL,
	`line_total` int NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `order_line_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `order` (
	`id` int AUTO_INCREMENT NOT NULL,
	`number` varchar(20) NOT NULL,
	`user_id` varchar(255),
	`email` varchar(255) NOT NULL,
	`shopper_name` varchar(120) NOT NULL,
	`status` enum('awaiting_payment','paid','cutting','sewn','finished','shipped','delivered','cancelled','refunded') NOT NULL DEFAULT 'awaiting_payment',
	`currency` varchar(3) NOT NULL DEFAULT 'EUR',
	`subtotal` int NOT NULL,
	`shipping` int NOT NULL,
	`total` int NOT NULL,
	`refunded_total` int NOT NULL DEFAULT 0,
	`promised_date` date NOT NULL,
	`shipping_address` json NOT NULL,
	`carrier` varchar(60),
	`tracking_number` varchar(80),
	`house_rules_id` int NOT NULL,
	`paid_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `order_id` PRIMARY KEY(`id`),
	CONSTRAINT `order_number_unique` UNIQUE(`number`)
);
--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int,
	`to_address` varchar(255) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`attempts` int NOT NULL DEFAULT 0,
	`last_error` varchar(500),
	`next_attempt_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`sent_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `mail_outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `payment` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`provider` varchar(20) NOT NULL DEFAULT 'stripe',
	`checkout_session_id` varchar(255) NOT NULL,
	`payment_intent_id` varchar(255),
	`amount` int NOT NULL,
	`refunded_amount` int NOT NULL DEFAULT 0,
	`currency` varchar(3) NOT NULL,
	`state` enum('open','paid','expired','failed','partially_refunded','refunded') NOT NULL DEFAULT 'open',
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `payment_id` PRIMARY KEY(`id`),
	CONSTRAINT `payment_checkout_session_id_unique` UNIQUE(`checkout_session_id`)
);
--> statement-breakpoint
CREATE TABLE `session` (
	`sessionToken` varchar(255) NOT NULL,
	`userId` varchar(255) NOT NULL,
	`expires` timestamp NOT NULL,
	CONSTRAINT `session_sessionToken` PRIMARY KEY(`sessionToken`)
);
--> statement-breakpoint
CREATE TABLE `shop_setting` (
	`key` varchar(80) NOT NULL,
	`value` json NOT NULL,
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `shop_setting_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_attempt` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(255) NOT NULL,
	`succeeded` boolean NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sign_in_attempt_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `style` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`name` varchar(120) NOT NULL,
	`kind` varchar(40) NOT NULL,
	`description` text NOT NULL,
	`making_price` int NOT NULL,
	`option_prices` json NOT NULL,
	`lead_days` int NOT NULL,
	`sort_order` int NOT NULL DEFAULT 0,
	`retired_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `style_id` PRIMARY KEY(`id`),
	CONSTRAINT `style_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `upload` (
	`id` int AUTO_INCREMENT NOT NULL,
	`owner_id` varchar(255),
	`purpose` varchar(40) NOT NULL,
	`storage_key` varchar(255) NOT NULL,
	`mime` varchar(80) NOT NULL,
	`bytes` int NOT NULL,
	`width` int,
	`height` int,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `upload_id` PRIMARY KEY(`id`),
	CONSTRAINT `upload_storage_key_unique` UNIQUE(`storage_key`)
);
--> statement-breakpoint
CREATE TABLE `user` (
	`id` varchar(255) NOT NULL,
	`name` varchar(255),
	`email` varchar(255),
	`emailVerified` timestamp(3),
	`image` varchar(255),
	`role` enum('shopper','cutter','owner') NOT NULL DEFAULT 'shopper',
	`password_hash` varchar(255),
	`disabled_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `user_id` PRIMARY KEY(`id`),
	CONSTRAINT `user_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `verificationToken` (
	`identifier` varchar(255) NOT NULL,
	`token` varchar(255) NOT NULL,
	`expires` timestamp NOT NULL,
	CONSTRAINT `verificationToken_identifier_token_pk` PRIMARY KEY(`identifier`,`token`)
);
--> statement-breakpoint
CREATE TABLE `webhook_event` (
	`id` varchar(255) NOT NULL,
	`type` varchar(80) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `webhook_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `account` ADD CONSTRAINT `account_userId_user_id_fk` FOREIGN KEY (`userId`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fabric` ADD CONSTRAINT `fabric_image_upload_id_upload_id_fk` FOREIGN KEY (`image_upload_id`) REFERENCES `upload`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `house_rules` ADD CONSTRAINT `house_rules_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measurement_profile` ADD CONSTRAINT `measurement_profile_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_event` ADD CONSTRAINT `order_event_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_event` ADD CONSTRAINT `order_event_actor_id_user_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_line` ADD CONSTRAINT `order_line_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_line` ADD CONSTRAINT `order_line_style_id_style_id_fk` FOREIGN KEY (`style_id`) REFERENCES `style`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_line` ADD CONSTRAINT `order_line_fabric_id_fabric_id_fk` FOREIGN KEY (`fabric_id`) REFERENCES `fabric`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order` ADD CONSTRAINT `order_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order` ADD CONSTRAINT `order_house_rules_id_house_rules_id_fk` FOREIGN KEY (`house_rules_id`) REFERENCES `house_rules`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD CONSTRAINT `mail_outbox_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `payment` ADD CONSTRAINT `payment_order_id_order_id_fk` FOREIGN KEY (`order_id`) REFERENCES `order`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `session` ADD CONSTRAINT `session_userId_user_id_fk` FOREIGN KEY (`userId`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `upload` ADD CONSTRAINT `upload_owner_id_user_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `account_user_idx` ON `account` (`userId`);--> statement-breakpoint
CREATE INDEX `fabric_image_idx` ON `fabric` (`image_upload_id`);--> statement-breakpoint
CREATE INDEX `measurement_profile_user_idx` ON `measurement_profile` (`user_id`);--> statement-breakpoint
CREATE INDEX `order_event_order_idx` ON `order_event` (`order_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `order_event_actor_idx` ON `order_event` (`actor_id`);--> statement-breakpoint
CREATE INDEX `order_line_order_idx` ON `order_line` (`order_id`);--> statement-breakpoint
CREATE INDEX `order_line_style_idx` ON `order_line` (`style_id`);--> statement-breakpoint
CREATE INDEX `order_line_fabric_idx` ON `order_line` (`fabric_id`);--> statement-breakpoint
CREATE INDEX `order_status_idx` ON `order` (`status`,`promised_date`);--> statement-breakpoint
CREATE INDEX `order_user_idx` ON `order` (`user_id`);--> statement-breakpoint
CREATE INDEX `order_created_idx` ON `order` (`created_at`);--> statement-breakpoint
CREATE INDEX `order_rules_idx` ON `order` (`house_rules_id`);--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`sent_at`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_order_idx` ON `mail_outbox` (`order_id`);--> statement-breakpoint
CREATE INDEX `payment_order_idx` ON `payment` (`order_id`);--> statement-breakpoint
CREATE INDEX `payment_intent_idx` ON `payment` (`payment_intent_id`);--> statement-breakpoint
CREATE INDEX `session_user_idx` ON `session` (`userId`);--> statement-breakpoint
CREATE INDEX `sign_in_attempt_email_idx` ON `sign_in_attempt` (`email`,`created_at`);--> statement-breakpoint
CREATE INDEX `upload_owner_idx` ON `upload` (`owner_id`);