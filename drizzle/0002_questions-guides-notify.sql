CREATE TABLE `guide_reviews` (
	`id` text PRIMARY KEY NOT NULL,
	`guide_slug` text NOT NULL,
	`reviewer_id` text,
	`note` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`reviewer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `guide_reviews_slug_idx` ON `guide_reviews` (`guide_slug`,`created_at`);--> statement-breakpoint
CREATE TABLE `guide_suggestions` (
	`id` text PRIMARY KEY NOT NULL,
	`guide_slug` text NOT NULL,
	`section` text,
	`body` text NOT NULL,
	`author_id` text,
	`state` text DEFAULT 'open' NOT NULL,
	`created_at` integer NOT NULL,
	`decided_at` integer,
	`decided_by_id` text,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`decided_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `guide_suggestions_slug_idx` ON `guide_suggestions` (`guide_slug`,`state`);--> statement-breakpoint
ALTER TABLE `subsystems` ADD `calculations_apply` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `users` ADD `notify_questions` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `users` ADD `notify_answers` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `comments` ADD `kind` text DEFAULT 'note' NOT NULL;--> statement-breakpoint
ALTER TABLE `comments` ADD `answered_at` integer;--> statement-breakpoint
ALTER TABLE `comments` ADD `answered_by_id` text REFERENCES users(id) ON DELETE set null;