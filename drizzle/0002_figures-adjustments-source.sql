ALTER TABLE `measurement_profile` ADD `waist_to_knee_cm` decimal(5,1);--> statement-breakpoint
ALTER TABLE `measurement_profile` ADD `adjustments` json;--> statement-breakpoint
ALTER TABLE `measurement_profile` ADD `figures_source` enum('measured','size_chart','flat_garment') DEFAULT 'measured' NOT NULL;--> statement-breakpoint
ALTER TABLE `order_line` ADD `adjustments` json;--> statement-breakpoint
ALTER TABLE `order_line` ADD `figures_source` enum('measured','size_chart','flat_garment') DEFAULT 'measured' NOT NULL;