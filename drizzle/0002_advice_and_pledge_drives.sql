CREATE TABLE `advice_requests` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`requester_id` bigint unsigned NOT NULL,
	`message` text NOT NULL,
	`preferred_times` varchar(500) NOT NULL DEFAULT '',
	`status` enum('new','assigned','closed') NOT NULL DEFAULT 'new',
	`advisor_id` bigint unsigned,
	`assigned_by` bigint unsigned,
	`assigned_at` timestamp(3),
	`closed_at` timestamp(3),
	`closing_note` varchar(500),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `advice_requests_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `recommendations` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`visit_id` bigint unsigned NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`change` json NOT NULL,
	`summary` varchar(400) NOT NULL,
	`predicted` json NOT NULL,
	`based_on_version` int unsigned NOT NULL,
	`status` enum('proposed','accepted','declined') NOT NULL DEFAULT 'proposed',
	`decided_by` bigint unsigned,
	`decided_at` timestamp(3),
	`decline_reason` varchar(500),
	`applied_version` int unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `recommendations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `site_visits` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`request_id` bigint unsigned NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`advisor_id` bigint unsigned NOT NULL,
	`visited_on` date NOT NULL,
	`notes` text NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `site_visits_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `visit_photos` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`visit_id` bigint unsigned NOT NULL,
	`storage_key` varchar(200) NOT NULL,
	`content_type` varchar(60) NOT NULL,
	`bytes` int unsigned NOT NULL,
	`caption` varchar(300) NOT NULL DEFAULT '',
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `visit_photos_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `visit_pins` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`visit_id` bigint unsigned NOT NULL,
	`x` double NOT NULL,
	`y` double NOT NULL,
	`comment` varchar(1000) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `visit_pins_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `yard_invites` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`email` varchar(254) NOT NULL,
	`role` enum('viewer','editor') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`invited_by` bigint unsigned NOT NULL,
	`accepted_by` bigint unsigned,
	`accepted_at` timestamp(3),
	`revoked_at` timestamp(3),
	`expires_at` timestamp(3) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `yard_invites_id` PRIMARY KEY(`id`),
	CONSTRAINT `yard_invites_token_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `drive_mail_deliveries` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`mailing_id` bigint unsigned NOT NULL,
	`pledge_id` bigint unsigned NOT NULL,
	`sent_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `drive_mail_deliveries_id` PRIMARY KEY(`id`),
	CONSTRAINT `drive_mail_deliveries_unique` UNIQUE(`mailing_id`,`pledge_id`)
);
--> statement-breakpoint
CREATE TABLE `drive_mailings` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`drive_id` bigint unsigned NOT NULL,
	`kind` enum('reminder','thanks') NOT NULL,
	`audience` enum('all','pledged','reached','verified') NOT NULL,
	`subject` varchar(200) NOT NULL,
	`body` text NOT NULL,
	`batch` varchar(80) NOT NULL,
	`recipients` int unsigned NOT NULL DEFAULT 0,
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `drive_mailings_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `drives` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`starts_on` date NOT NULL,
	`ends_on` date NOT NULL,
	`goal` decimal(4,3) NOT NULL DEFAULT 0.7,
	`certifies` enum('count','area','volume') NOT NULL DEFAULT 'area',
	`target` int unsigned NOT NULL,
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `drives_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `pledges` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`drive_id` bigint unsigned NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`neighbourhood` varchar(80) NOT NULL,
	`consent` boolean NOT NULL,
	`status` enum('pledged','reached','verified') NOT NULL DEFAULT 'pledged',
	`pledged_on` date NOT NULL,
	`count_native` double NOT NULL DEFAULT 0,
	`count_total` double NOT NULL DEFAULT 0,
	`count_share` double NOT NULL DEFAULT 0,
	`area_native` double NOT NULL DEFAULT 0,
	`area_total` double NOT NULL DEFAULT 0,
	`area_share` double NOT NULL DEFAULT 0,
	`volume_native` double NOT NULL DEFAULT 0,
	`volume_total` double NOT NULL DEFAULT 0,
	`volume_share` double NOT NULL DEFAULT 0,
	`lawn_area` double NOT NULL DEFAULT 0,
	`base_area_native` double NOT NULL DEFAULT 0,
	`base_lawn_area` double NOT NULL DEFAULT 0,
	`base_share` double NOT NULL DEFAULT 0,
	`reached_at` timestamp(3),
	`verified_at` timestamp(3),
	`verified_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `pledges_id` PRIMARY KEY(`id`),
	CONSTRAINT `pledges_yard_drive_unique` UNIQUE(`yard_id`,`drive_id`)
);
--> statement-breakpoint
CREATE TABLE `share_snapshots` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`day` date NOT NULL,
	`count_native` double NOT NULL DEFAULT 0,
	`count_total` double NOT NULL DEFAULT 0,
	`count_share` double NOT NULL DEFAULT 0,
	`area_native` double NOT NULL DEFAULT 0,
	`area_total` double NOT NULL DEFAULT 0,
	`area_share` double NOT NULL DEFAULT 0,
	`volume_native` double NOT NULL DEFAULT 0,
	`volume_total` double NOT NULL DEFAULT 0,
	`volume_share` double NOT NULL DEFAULT 0,
	`lawn_area` double NOT NULL DEFAULT 0,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `share_snapshots_id` PRIMARY KEY(`id`),
	CONSTRAINT `share_snapshots_yard_day_unique` UNIQUE(`yard_id`,`day`)
);
--> statement-breakpoint
ALTER TABLE `advice_requests` ADD CONSTRAINT `advice_requests_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `advice_requests` ADD CONSTRAINT `advice_requests_requester_id_users_id_fk` FOREIGN KEY (`requester_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `advice_requests` ADD CONSTRAINT `advice_requests_advisor_id_users_id_fk` FOREIGN KEY (`advisor_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `advice_requests` ADD CONSTRAINT `advice_requests_assigned_by_users_id_fk` FOREIGN KEY (`assigned_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `recommendations` ADD CONSTRAINT `recommendations_visit_id_site_visits_id_fk` FOREIGN KEY (`visit_id`) REFERENCES `site_visits`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `recommendations` ADD CONSTRAINT `recommendations_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `recommendations` ADD CONSTRAINT `recommendations_decided_by_users_id_fk` FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `site_visits` ADD CONSTRAINT `site_visits_request_id_advice_requests_id_fk` FOREIGN KEY (`request_id`) REFERENCES `advice_requests`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `site_visits` ADD CONSTRAINT `site_visits_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `site_visits` ADD CONSTRAINT `site_visits_advisor_id_users_id_fk` FOREIGN KEY (`advisor_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `visit_photos` ADD CONSTRAINT `visit_photos_visit_id_site_visits_id_fk` FOREIGN KEY (`visit_id`) REFERENCES `site_visits`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `visit_pins` ADD CONSTRAINT `visit_pins_visit_id_site_visits_id_fk` FOREIGN KEY (`visit_id`) REFERENCES `site_visits`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `yard_invites` ADD CONSTRAINT `yard_invites_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `yard_invites` ADD CONSTRAINT `yard_invites_invited_by_users_id_fk` FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `yard_invites` ADD CONSTRAINT `yard_invites_accepted_by_users_id_fk` FOREIGN KEY (`accepted_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `drive_mail_deliveries` ADD CONSTRAINT `drive_mail_deliveries_mailing_id_drive_mailings_id_fk` FOREIGN KEY (`mailing_id`) REFERENCES `drive_mailings`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `drive_mail_deliveries` ADD CONSTRAINT `drive_mail_deliveries_pledge_id_pledges_id_fk` FOREIGN KEY (`pledge_id`) REFERENCES `pledges`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `drive_mailings` ADD CONSTRAINT `drive_mailings_drive_id_drives_id_fk` FOREIGN KEY (`drive_id`) REFERENCES `drives`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `drive_mailings` ADD CONSTRAINT `drive_mailings_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `drives` ADD CONSTRAINT `drives_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `pledges` ADD CONSTRAINT `pledges_drive_id_drives_id_fk` FOREIGN KEY (`drive_id`) REFERENCES `drives`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `pledges` ADD CONSTRAINT `pledges_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `pledges` ADD CONSTRAINT `pledges_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `pledges` ADD CONSTRAINT `pledges_verified_by_users_id_fk` FOREIGN KEY (`verified_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_snapshots` ADD CONSTRAINT `share_snapshots_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `advice_requests_status_idx` ON `advice_requests` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `advice_requests_advisor_idx` ON `advice_requests` (`advisor_id`,`status`);--> statement-breakpoint
CREATE INDEX `advice_requests_yard_idx` ON `advice_requests` (`yard_id`,`status`);--> statement-breakpoint
CREATE INDEX `recommendations_yard_idx` ON `recommendations` (`yard_id`,`status`);--> statement-breakpoint
CREATE INDEX `recommendations_visit_idx` ON `recommendations` (`visit_id`);--> statement-breakpoint
CREATE INDEX `site_visits_request_idx` ON `site_visits` (`request_id`);--> statement-breakpoint
CREATE INDEX `site_visits_yard_idx` ON `site_visits` (`yard_id`);--> statement-breakpoint
CREATE INDEX `visit_photos_visit_idx` ON `visit_photos` (`visit_id`);--> statement-breakpoint
CREATE INDEX `visit_pins_visit_idx` ON `visit_pins` (`visit_id`);--> statement-breakpoint
CREATE INDEX `yard_invites_yard_idx` ON `yard_invites` (`yard_id`,`revoked_at`);--> statement-breakpoint
CREATE INDEX `yard_invites_email_idx` ON `yard_invites` (`email`);--> statement-breakpoint
CREATE INDEX `drive_mailings_drive_idx` ON `drive_mailings` (`drive_id`);--> statement-breakpoint
CREATE INDEX `drives_dates_idx` ON `drives` (`starts_on`,`ends_on`);--> statement-breakpoint
CREATE INDEX `pledges_drive_status_idx` ON `pledges` (`drive_id`,`consent`,`status`);--> statement-breakpoint
CREATE INDEX `pledges_drive_neighbourhood_idx` ON `pledges` (`drive_id`,`consent`,`neighbourhood`);--> statement-breakpoint
CREATE INDEX `pledges_drive_count_idx` ON `pledges` (`drive_id`,`consent`,`count_share`);--> statement-breakpoint
CREATE INDEX `pledges_drive_area_idx` ON `pledges` (`drive_id`,`consent`,`area_share`);--> statement-breakpoint
CREATE INDEX `pledges_drive_volume_idx` ON `pledges` (`drive_id`,`consent`,`volume_share`);--> statement-breakpoint
CREATE INDEX `pledges_drive_day_idx` ON `pledges` (`drive_id`,`consent`,`pledged_on`);--> statement-breakpoint
CREATE INDEX `share_snapshots_day_idx` ON `share_snapshots` (`day`);