CREATE TABLE `material_confirmations` (
	`revision_id` text NOT NULL,
	`value` text NOT NULL,
	`user_id` text NOT NULL,
	`at` integer NOT NULL,
	PRIMARY KEY(`revision_id`, `value`),
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `notices` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`project_id` text,
	`calc_id` text,
	`revision_id` text,
	`kind` text NOT NULL,
	`text` text NOT NULL,
	`link` text NOT NULL,
	`read_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `notices_user` ON `notices` (`user_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `remark_replies` (
	`id` text PRIMARY KEY NOT NULL,
	`remark_id` text NOT NULL,
	`author_id` text NOT NULL,
	`text` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`remark_id`) REFERENCES `check_remarks`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `remark_replies_remark` ON `remark_replies` (`remark_id`);--> statement-breakpoint
CREATE TABLE `revision_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` text NOT NULL,
	`action` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`user_id` text NOT NULL,
	`reason` text,
	`statement` text,
	`signature` text,
	`at` integer NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `revision_events_revision` ON `revision_events` (`revision_id`,`at`);--> statement-breakpoint
CREATE TABLE `step_ticks` (
	`revision_id` text NOT NULL,
	`step_id` text NOT NULL,
	`user_id` text NOT NULL,
	`at` integer NOT NULL,
	PRIMARY KEY(`revision_id`, `step_id`),
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_check_remarks` (
	`id` text PRIMARY KEY NOT NULL,
	`revision_id` text NOT NULL,
	`step_id` text,
	`severity` text DEFAULT 'must-resolve' NOT NULL,
	`carried_from_id` text,
	`author_id` text NOT NULL,
	`text` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`response` text,
	`closed_by` text,
	`closed_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`closed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
INSERT INTO `__new_check_remarks`("id", "revision_id", "step_id", "author_id", "text", "status", "response", "created_at") SELECT "id", "revision_id", "step_id", "author_id", "text", "status", "response", "created_at" FROM `check_remarks`;--> statement-breakpoint
DROP TABLE `check_remarks`;--> statement-breakpoint
ALTER TABLE `__new_check_remarks` RENAME TO `check_remarks`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
ALTER TABLE `revisions` ADD `reason` text;--> statement-breakpoint
ALTER TABLE `revisions` ADD `submitted_failing` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `revisions` ADD `assigned_checker_id` text REFERENCES users(id);--> statement-breakpoint
ALTER TABLE `revisions` ADD `assigned_approver_id` text REFERENCES users(id);--> statement-breakpoint
ALTER TABLE `revisions` ADD `verification_code` text;--> statement-breakpoint
CREATE UNIQUE INDEX `revisions_verification_code_unique` ON `revisions` (`verification_code`);