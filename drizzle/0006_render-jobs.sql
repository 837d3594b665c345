CREATE TABLE `render_jobs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` text NOT NULL,
	`state` text DEFAULT 'queued' NOT NULL,
	`stage` text,
	`attempts` integer DEFAULT 0 NOT NULL,
	`claimed_by` text,
	`claimed_until` integer,
	`error` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`finished_at` integer,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `render_jobs_state` ON `render_jobs` (`state`,`id`);--> statement-breakpoint
CREATE INDEX `render_jobs_revision` ON `render_jobs` (`revision_id`);