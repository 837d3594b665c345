ALTER TABLE `check_remarks` ADD `author_name` text;--> statement-breakpoint
ALTER TABLE `material_confirmations` ADD `user_name` text;--> statement-breakpoint
ALTER TABLE `remark_replies` ADD `author_name` text;--> statement-breakpoint
ALTER TABLE `revision_events` ADD `actor_name` text;--> statement-breakpoint
ALTER TABLE `step_ticks` ADD `user_name` text;