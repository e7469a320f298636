ALTER TABLE `drive_summaries` DROP COLUMN `body`;--> statement-breakpoint
ALTER TABLE `drive_summaries` DROP COLUMN `body_version`;--> statement-breakpoint
ALTER TABLE `drive_summaries` DROP COLUMN `computed_at`;