CREATE TABLE `finishing_tick` (
	`batch_id` bigint unsigned NOT NULL,
	`step_id` varchar(24) NOT NULL,
	`done_by` varchar(255) NOT NULL,
	`done_at` datetime(3) NOT NULL,
	CONSTRAINT `finishing_tick_batch_id_step_id_pk` PRIMARY KEY(`batch_id`,`step_id`)
);
--> statement-breakpoint
CREATE TABLE `price_list` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`press_key` varchar(255) NOT NULL,
	`name` varchar(120) NOT NULL,
	`currency` char(3) NOT NULL,
	`prices` json NOT NULL,
	`updated_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `price_list_id` PRIMARY KEY(`id`),
	CONSTRAINT `price_list_name` UNIQUE(`press_key`,`name`)
);
--> statement-breakpoint
CREATE TABLE `run_event` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`kind` varchar(16) NOT NULL,
	`on_date` date NOT NULL,
	`copies` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `run_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `run_plan` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`price_list_id` bigint unsigned,
	`shop_quote_id` bigint unsigned,
	`quantities` json NOT NULL,
	`timings` json NOT NULL,
	`minutes_per_week` int NOT NULL DEFAULT 0,
	`print_mode` varchar(16) NOT NULL DEFAULT 'all-at-once',
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `run_plan_id` PRIMARY KEY(`id`),
	CONSTRAINT `run_plan_anthology_id_unique` UNIQUE(`anthology_id`)
);
--> statement-breakpoint
CREATE TABLE `run_stock` (
	`anthology_id` bigint unsigned NOT NULL,
	`movement_count` int NOT NULL DEFAULT 0,
	CONSTRAINT `run_stock_anthology_id` PRIMARY KEY(`anthology_id`)
);
--> statement-breakpoint
CREATE TABLE `shop_quote` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`press_key` varchar(255) NOT NULL,
	`shop_name` varchar(120) NOT NULL,
	`currency` char(3) NOT NULL,
	`tiers` json NOT NULL,
	`turnaround_days` int NOT NULL,
	`updated_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `shop_quote_id` PRIMARY KEY(`id`),
	CONSTRAINT `shop_quote_name` UNIQUE(`press_key`,`shop_name`)
);
--> statement-breakpoint
CREATE TABLE `stock_movement` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`batch_id` bigint unsigned,
	`kind` varchar(24) NOT NULL,
	`sheet_sets` int NOT NULL DEFAULT 0,
	`copies` int NOT NULL DEFAULT 0,
	`reason` varchar(500) NOT NULL DEFAULT '',
	`event_id` bigint unsigned,
	`contributor_copy_id` bigint unsigned,
	`actor_id` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `stock_movement_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `contributor_copy` MODIFY COLUMN `delivery` varchar(16) NOT NULL DEFAULT 'collect';--> statement-breakpoint
ALTER TABLE `finishing_batch` MODIFY COLUMN `due_on` date;--> statement-breakpoint
ALTER TABLE `contributor_copy` ADD `event_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `contributor_copy` ADD `done_by` varchar(255);--> statement-breakpoint
ALTER TABLE `finishing_batch` ADD `position` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `finishing_batch` ADD `event_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `finishing_batch` ADD `done_by` varchar(255);--> statement-breakpoint
ALTER TABLE `finishing_tick` ADD CONSTRAINT `finishing_tick_batch_id_finishing_batch_id_fk` FOREIGN KEY (`batch_id`) REFERENCES `finishing_batch`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_event` ADD CONSTRAINT `run_event_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_plan` ADD CONSTRAINT `run_plan_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_plan` ADD CONSTRAINT `run_plan_price_list_id_price_list_id_fk` FOREIGN KEY (`price_list_id`) REFERENCES `price_list`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_plan` ADD CONSTRAINT `run_plan_shop_quote_id_shop_quote_id_fk` FOREIGN KEY (`shop_quote_id`) REFERENCES `shop_quote`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_stock` ADD CONSTRAINT `run_stock_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock_movement` ADD CONSTRAINT `stock_movement_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock_movement` ADD CONSTRAINT `stock_movement_batch_id_finishing_batch_id_fk` FOREIGN KEY (`batch_id`) REFERENCES `finishing_batch`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock_movement` ADD CONSTRAINT `stock_movement_event_id_run_event_id_fk` FOREIGN KEY (`event_id`) REFERENCES `run_event`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `run_event_anthology` ON `run_event` (`anthology_id`,`on_date`);--> statement-breakpoint
CREATE INDEX `stock_movement_anthology` ON `stock_movement` (`anthology_id`,`batch_id`);--> statement-breakpoint
ALTER TABLE `contributor_copy` ADD CONSTRAINT `contributor_copy_event_id_run_event_id_fk` FOREIGN KEY (`event_id`) REFERENCES `run_event`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `finishing_batch` ADD CONSTRAINT `finishing_batch_event_id_run_event_id_fk` FOREIGN KEY (`event_id`) REFERENCES `run_event`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `finishing_batch_anthology` ON `finishing_batch` (`anthology_id`,`position`);