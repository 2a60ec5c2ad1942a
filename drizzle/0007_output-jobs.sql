CREATE TABLE `output_job` (
	`id` int AUTO_INCREMENT NOT NULL,
	`kinds` json NOT NULL,
	`requested_by` varchar(255),
	`order_ids` json NOT NULL,
	`status` enum('queued','running','done','failed') NOT NULL DEFAULT 'queued',
	`done` int NOT NULL DEFAULT 0,
	`total` int NOT NULL,
	`failures` json NOT NULL,
	`error` varchar(500),
	`result_key` varchar(64),
	`result_bytes` int,
	`claimed_by` varchar(64),
	`attempts` int NOT NULL DEFAULT 0,
	`heartbeat_at` timestamp(3) NULL,
	`started_at` timestamp(3) NULL,
	`finished_at` timestamp(3) NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `output_job_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `output_job` ADD CONSTRAINT `output_job_requested_by_user_id_fk` FOREIGN KEY (`requested_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `output_job_status_idx` ON `output_job` (`status`,`id`);--> statement-breakpoint
CREATE INDEX `output_job_requester_idx` ON `output_job` (`requested_by`);
