CREATE TABLE `jobs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` varchar(64) NOT NULL,
	`payload` json NOT NULL,
	`run_at` timestamp(3) NOT NULL,
	`dedupe_key` varchar(191) NOT NULL,
	`batch_key` varchar(128),
	`status` enum('pending','claimed','sent','failed','cancelled') NOT NULL DEFAULT 'pending',
	`attempts` int unsigned NOT NULL DEFAULT 0,
	`max_attempts` int unsigned NOT NULL DEFAULT 5,
	`claimed_by` varchar(96),
	`claimed_at` timestamp(3),
	`sent_at` timestamp(3),
	`last_error` varchar(2000),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `jobs_id` PRIMARY KEY(`id`),
	CONSTRAINT `jobs_dedupe_key_unique` UNIQUE(`dedupe_key`)
);
--> statement-breakpoint
CREATE INDEX `jobs_status_run_at_idx` ON `jobs` (`status`,`run_at`);--> statement-breakpoint
CREATE INDEX `jobs_status_claimed_at_idx` ON `jobs` (`status`,`claimed_at`);--> statement-breakpoint
CREATE INDEX `jobs_batch_status_idx` ON `jobs` (`batch_key`,`status`);