CREATE TABLE `page_separation` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`piece_page_id` bigint unsigned NOT NULL,
	`ink` varchar(40) NOT NULL,
	`current_version_id` bigint unsigned,
	`revision` int NOT NULL DEFAULT 0,
	CONSTRAINT `page_separation_id` PRIMARY KEY(`id`),
	CONSTRAINT `page_separation_ink` UNIQUE(`piece_page_id`,`ink`)
);
--> statement-breakpoint
CREATE TABLE `print_output` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`kind` varchar(16) NOT NULL,
	`ink` varchar(40),
	`state` varchar(16) NOT NULL DEFAULT 'queued',
	`job_id` varchar(64),
	`map_version` int NOT NULL,
	`sheet_width_mm` double,
	`sheet_height_mm` double,
	`sheet_name` varchar(40),
	`pages_done` int NOT NULL DEFAULT 0,
	`pages_total` int NOT NULL DEFAULT 0,
	`storage_key` varchar(128),
	`file_name` varchar(255),
	`size_bytes` bigint unsigned,
	`page_count` int,
	`stale_at` datetime(3),
	`error` text,
	`requested_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`finished_at` datetime(3),
	CONSTRAINT `print_output_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `file_version` ADD `ink` varchar(40);--> statement-breakpoint
ALTER TABLE `piece` ADD `credit_requested_at` datetime(3);--> statement-breakpoint
ALTER TABLE `page_separation` ADD CONSTRAINT `page_separation_piece_page_id_piece_page_id_fk` FOREIGN KEY (`piece_page_id`) REFERENCES `piece_page`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `print_output` ADD CONSTRAINT `print_output_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `print_output_anthology` ON `print_output` (`anthology_id`,`kind`);