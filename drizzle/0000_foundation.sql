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
CREATE TABLE `anthology` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`title` varchar(200) NOT NULL,
	`press_name` varchar(200),
	`summary` text,
	`stage` varchar(24) NOT NULL DEFAULT 'planning',
	`trim_preset` varchar(32) NOT NULL,
	`trim_width_mm` double NOT NULL,
	`trim_height_mm` double NOT NULL,
	`bleed_mm` double NOT NULL,
	`safe_margin_mm` double NOT NULL,
	`binding` varchar(24) NOT NULL,
	`page_count_target` int NOT NULL,
	`max_pages` int NOT NULL,
	`cover_stock` varchar(16) NOT NULL,
	`cover_paper_gsm` int,
	`paper_gsm` int NOT NULL,
	`paper_caliper_mm` double NOT NULL,
	`print_method` varchar(24) NOT NULL,
	`inks` json NOT NULL,
	`inks_per_pass` int NOT NULL DEFAULT 1,
	`min_ppi` int NOT NULL,
	`currency` char(3) NOT NULL DEFAULT 'USD',
	`map_version` int NOT NULL DEFAULT 0,
	`created_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `anthology_id` PRIMARY KEY(`id`),
	CONSTRAINT `anthology_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `open_call` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`theme` varchar(200) NOT NULL,
	`brief` text NOT NULL,
	`opens_at` datetime NOT NULL,
	`closes_at` datetime NOT NULL,
	`time_zone` varchar(64) NOT NULL,
	`allowed_kinds` json NOT NULL,
	`max_run_pages` int NOT NULL DEFAULT 4,
	`pieces_per_person` int NOT NULL DEFAULT 2,
	`allowed_inks` json NOT NULL,
	`fee_kind` varchar(16) NOT NULL DEFAULT 'none',
	`fee_cents` int NOT NULL DEFAULT 0,
	`sales_share_bp` int NOT NULL DEFAULT 0,
	`contributor_copies` int NOT NULL DEFAULT 1,
	`rights_asked` text NOT NULL,
	`published_at` datetime,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `open_call_id` PRIMARY KEY(`id`),
	CONSTRAINT `open_call_anthology_id_unique` UNIQUE(`anthology_id`)
);
--> statement-breakpoint
CREATE TABLE `contributor_copy` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`contributor_id` varchar(255) NOT NULL,
	`quantity` int NOT NULL,
	`delivery` varchar(16) NOT NULL DEFAULT 'hand',
	`handed_over_at` datetime,
	`note` text,
	CONSTRAINT `contributor_copy_id` PRIMARY KEY(`id`),
	CONSTRAINT `contributor_copy_person` UNIQUE(`anthology_id`,`contributor_id`)
);
--> statement-breakpoint
CREATE TABLE `editor_note` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`piece_id` bigint unsigned NOT NULL,
	`author_id` varchar(255) NOT NULL,
	`body` text NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `editor_note_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `email_log` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned,
	`piece_id` bigint unsigned,
	`to_email` varchar(255) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`kind` varchar(40) NOT NULL,
	`dedupe_key` varchar(191),
	`error` text,
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `email_log_id` PRIMARY KEY(`id`),
	CONSTRAINT `email_log_dedupe_key_unique` UNIQUE(`dedupe_key`)
);
--> statement-breakpoint
CREATE TABLE `file_version` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`piece_page_id` bigint unsigned NOT NULL,
	`version_number` int NOT NULL,
	`storage_key` varchar(128) NOT NULL,
	`file_name` varchar(255) NOT NULL,
	`mime_type` varchar(100) NOT NULL,
	`size_bytes` bigint unsigned NOT NULL,
	`md5` char(32),
	`report` json NOT NULL,
	`verdict` varchar(16) NOT NULL,
	`thumbnail_webp` mediumblob,
	`thumbnail_width_px` int,
	`thumbnail_height_px` int,
	`uploaded_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `file_version_id` PRIMARY KEY(`id`),
	CONSTRAINT `file_version_number` UNIQUE(`piece_page_id`,`version_number`)
);
--> statement-breakpoint
CREATE TABLE `finishing_batch` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`label` varchar(120) NOT NULL,
	`copies` int NOT NULL,
	`due_on` datetime,
	`done_at` datetime,
	CONSTRAINT `finishing_batch_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `invitation` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`email` varchar(255) NOT NULL,
	`role` varchar(16) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`invited_by` varchar(255) NOT NULL,
	`expires_at` datetime NOT NULL,
	`accepted_at` datetime,
	`accepted_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `invitation_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitation_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `map_event` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`actor_id` varchar(255) NOT NULL,
	`map_version` int NOT NULL,
	`action` varchar(32) NOT NULL,
	`detail` json NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `map_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `membership` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`role` varchar(16) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `membership_id` PRIMARY KEY(`id`),
	CONSTRAINT `membership_person` UNIQUE(`anthology_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `page_slot` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`page_number` int NOT NULL,
	`reservation` varchar(16),
	`piece_id` bigint unsigned,
	`piece_page_index` int,
	`locked` boolean NOT NULL DEFAULT false,
	CONSTRAINT `page_slot_id` PRIMARY KEY(`id`),
	CONSTRAINT `page_slot_number` UNIQUE(`anthology_id`,`page_number`)
);
--> statement-breakpoint
CREATE TABLE `payout_entry` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`contributor_id` varchar(255) NOT NULL,
	`kind` varchar(24) NOT NULL,
	`amount_cents` bigint NOT NULL,
	`currency` char(3) NOT NULL,
	`state` varchar(16) NOT NULL DEFAULT 'owed',
	`memo` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `payout_entry_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `piece_event` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`piece_id` bigint unsigned NOT NULL,
	`actor_id` varchar(255),
	`from_status` varchar(24),
	`to_status` varchar(24) NOT NULL,
	`message` text,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `piece_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `piece_page` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`piece_id` bigint unsigned NOT NULL,
	`page_index` int NOT NULL,
	`alt_text` text,
	`current_version_id` bigint unsigned,
	`revision` int NOT NULL DEFAULT 0,
	CONSTRAINT `piece_page_id` PRIMARY KEY(`id`),
	CONSTRAINT `piece_page_position` UNIQUE(`piece_id`,`page_index`)
);
--> statement-breakpoint
CREATE TABLE `piece` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`contributor_id` varchar(255) NOT NULL,
	`title` varchar(200) NOT NULL,
	`kind` varchar(16) NOT NULL,
	`page_count` int NOT NULL,
	`inks` json NOT NULL,
	`credit_line` varchar(200) NOT NULL,
	`credit_approved_at` datetime,
	`statement` text,
	`status` varchar(24) NOT NULL DEFAULT 'awaiting-review',
	`verdict` varchar(16) NOT NULL DEFAULT 'missing',
	`left_out` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `piece_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sale` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`label` varchar(120) NOT NULL,
	`copies` int NOT NULL,
	`gross_cents` bigint NOT NULL,
	`costs_cents` bigint NOT NULL DEFAULT 0,
	`sold_on` datetime NOT NULL,
	CONSTRAINT `sale_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `session` (
	`sessionToken` varchar(255) NOT NULL,
	`userId` varchar(255) NOT NULL,
	`expires` timestamp NOT NULL,
	CONSTRAINT `session_sessionToken` PRIMARY KEY(`sessionToken`)
);
--> statement-breakpoint
CREATE TABLE `user` (
	`id` varchar(255) NOT NULL,
	`name` varchar(255),
	`email` varchar(255),
	`emailVerified` timestamp(3),
	`image` varchar(255),
	`password_hash` varchar(255),
	`created_at` datetime(3),
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
ALTER TABLE `account` ADD CONSTRAINT `account_userId_user_id_fk` FOREIGN KEY (`userId`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `open_call` ADD CONSTRAINT `open_call_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `contributor_copy` ADD CONSTRAINT `contributor_copy_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editor_note` ADD CONSTRAINT `editor_note_piece_id_piece_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `piece`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `file_version` ADD CONSTRAINT `file_version_piece_page_id_piece_page_id_fk` FOREIGN KEY (`piece_page_id`) REFERENCES `piece_page`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `finishing_batch` ADD CONSTRAINT `finishing_batch_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitation` ADD CONSTRAINT `invitation_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `map_event` ADD CONSTRAINT `map_event_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `membership` ADD CONSTRAINT `membership_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `membership` ADD CONSTRAINT `membership_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `page_slot` ADD CONSTRAINT `page_slot_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `page_slot` ADD CONSTRAINT `page_slot_piece_id_piece_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `piece`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD CONSTRAINT `payout_entry_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `piece_event` ADD CONSTRAINT `piece_event_piece_id_piece_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `piece`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `piece_page` ADD CONSTRAINT `piece_page_piece_id_piece_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `piece`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `piece` ADD CONSTRAINT `piece_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `piece` ADD CONSTRAINT `piece_contributor_id_user_id_fk` FOREIGN KEY (`contributor_id`) REFERENCES `user`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sale` ADD CONSTRAINT `sale_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `session` ADD CONSTRAINT `session_userId_user_id_fk` FOREIGN KEY (`userId`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `editor_note_piece` ON `editor_note` (`piece_id`);--> statement-breakpoint
CREATE INDEX `email_log_anthology` ON `email_log` (`anthology_id`);--> statement-breakpoint
CREATE INDEX `invitation_anthology` ON `invitation` (`anthology_id`);--> statement-breakpoint
CREATE INDEX `map_event_anthology` ON `map_event` (`anthology_id`);--> statement-breakpoint
CREATE INDEX `membership_user` ON `membership` (`user_id`);--> statement-breakpoint
CREATE INDEX `payout_entry_person` ON `payout_entry` (`anthology_id`,`contributor_id`);--> statement-breakpoint
CREATE INDEX `piece_event_piece` ON `piece_event` (`piece_id`);--> statement-breakpoint
CREATE INDEX `piece_anthology` ON `piece` (`anthology_id`,`status`);--> statement-breakpoint
CREATE INDEX `piece_contributor` ON `piece` (`contributor_id`);