CREATE TABLE `output_preference` (
	`user_id` varchar(255) NOT NULL,
	`paper` enum('a4','letter','a0','roll','projector') NOT NULL,
	`roll_width_cm` decimal(4,1),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `output_preference_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
ALTER TABLE `output_preference` ADD CONSTRAINT `output_preference_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;
