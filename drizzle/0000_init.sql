CREATE TABLE `invitations` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`subsystems` text DEFAULT '[]' NOT NULL,
	`token_hash` text NOT NULL,
	`invited_by_id` text,
	`created_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`accepted_at` integer,
	`accepted_user_id` text,
	`revoked_at` integer,
	FOREIGN KEY (`invited_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`accepted_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_tokenHash_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invitations_email_idx` ON `invitations` (`email`);--> statement-breakpoint
CREATE TABLE `membership_subsystems` (
	`membership_id` text NOT NULL,
	`subsystem_slug` text NOT NULL,
	PRIMARY KEY(`membership_id`, `subsystem_slug`),
	FOREIGN KEY (`membership_id`) REFERENCES `season_memberships`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`subsystem_slug`) REFERENCES `subsystems`(`slug`) ON UPDATE cascade ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `membership_subsystems_slug_idx` ON `membership_subsystems` (`subsystem_slug`);--> statement-breakpoint
CREATE TABLE `password_resets` (
	`token_hash` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`created_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `password_resets_user_idx` ON `password_resets` (`user_id`);--> statement-breakpoint
CREATE TABLE `season_memberships` (
	`id` text PRIMARY KEY NOT NULL,
	`season_id` text NOT NULL,
	`user_id` text NOT NULL,
	`role` text NOT NULL,
	FOREIGN KEY (`season_id`) REFERENCES `seasons`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `season_memberships_unique` ON `season_memberships` (`season_id`,`user_id`);--> statement-breakpoint
CREATE INDEX `season_memberships_user_idx` ON `season_memberships` (`user_id`);--> statement-breakpoint
CREATE TABLE `seasons` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`starts_on` text NOT NULL,
	`ends_on` text NOT NULL,
	`phase` text NOT NULL,
	`is_current` integer DEFAULT false NOT NULL,
	`boat` text,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `seasons_name_unique` ON `seasons` (`name`);--> statement-breakpoint
CREATE UNIQUE INDEX `seasons_one_current` ON `seasons` (`is_current`) WHERE is_current = 1;--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`expires_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `sessions_user_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE TABLE `subsystems` (
	`slug` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`summary` text DEFAULT '' NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`password_hash` text NOT NULL,
	`digest_opt_in` integer DEFAULT false NOT NULL,
	`created_at` integer NOT NULL,
	`last_sign_in_at` integer
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE TABLE `attachments` (
	`id` text PRIMARY KEY NOT NULL,
	`record_id` text NOT NULL,
	`file_name` text NOT NULL,
	`content_type` text NOT NULL,
	`size` integer NOT NULL,
	`sha256` text NOT NULL,
	`uploaded_by_id` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`record_id`) REFERENCES `records`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `attachments_record_idx` ON `attachments` (`record_id`);--> statement-breakpoint
CREATE TABLE `comments` (
	`id` text PRIMARY KEY NOT NULL,
	`record_id` text NOT NULL,
	`author_id` text,
	`parent_id` text,
	`body` text NOT NULL,
	`created_at` integer NOT NULL,
	`edited_at` integer,
	FOREIGN KEY (`record_id`) REFERENCES `records`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `comments_record_idx` ON `comments` (`record_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `comments_created_idx` ON `comments` (`created_at`);--> statement-breakpoint
CREATE TABLE `record_calculations` (
	`record_id` text NOT NULL,
	`calculation_id` text NOT NULL,
	PRIMARY KEY(`record_id`, `calculation_id`),
	FOREIGN KEY (`record_id`) REFERENCES `records`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`calculation_id`) REFERENCES `calculations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `record_calculations_calc_idx` ON `record_calculations` (`calculation_id`);--> statement-breakpoint
CREATE TABLE `record_links` (
	`from_record_id` text NOT NULL,
	`to_record_id` text NOT NULL,
	`kind` text NOT NULL,
	`created_at` integer NOT NULL,
	PRIMARY KEY(`from_record_id`, `to_record_id`, `kind`),
	FOREIGN KEY (`from_record_id`) REFERENCES `records`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`to_record_id`) REFERENCES `records`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `record_links_to_idx` ON `record_links` (`to_record_id`);--> statement-breakpoint
CREATE TABLE `record_revisions` (
	`id` text PRIMARY KEY NOT NULL,
	`record_id` text NOT NULL,
	`version` integer NOT NULL,
	`title` text NOT NULL,
	`status` text NOT NULL,
	`body` text NOT NULL,
	`body_text` text DEFAULT '' NOT NULL,
	`editor_id` text,
	`note` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`record_id`) REFERENCES `records`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`editor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `record_revisions_version` ON `record_revisions` (`record_id`,`version`);--> statement-breakpoint
CREATE TABLE `records` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`subsystem_slug` text NOT NULL,
	`season_id` text NOT NULL,
	`status` text NOT NULL,
	`source` text,
	`author_id` text,
	`body` text NOT NULL,
	`body_html` text DEFAULT '' NOT NULL,
	`body_text` text DEFAULT '' NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	`updated_by_id` text,
	`reviewed_by_id` text,
	`reviewed_at` integer,
	`reviewed_version` integer,
	`review_note` text,
	`deleted_at` integer,
	FOREIGN KEY (`subsystem_slug`) REFERENCES `subsystems`(`slug`) ON UPDATE cascade ON DELETE no action,
	FOREIGN KEY (`season_id`) REFERENCES `seasons`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`reviewed_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `records_subsystem_season_idx` ON `records` (`subsystem_slug`,`season_id`);--> statement-breakpoint
CREATE INDEX `records_kind_status_idx` ON `records` (`kind`,`status`);--> statement-breakpoint
CREATE INDEX `records_updated_idx` ON `records` (`updated_at`);--> statement-breakpoint
CREATE TABLE `calculation_results` (
	`id` text PRIMARY KEY NOT NULL,
	`calculation_id` text NOT NULL,
	`engine_version` text NOT NULL,
	`outputs` text NOT NULL,
	`series` text,
	`warnings` text NOT NULL,
	`computed_by_id` text,
	`computed_at` integer NOT NULL,
	FOREIGN KEY (`calculation_id`) REFERENCES `calculations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`computed_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `calculation_results_calc_idx` ON `calculation_results` (`calculation_id`,`computed_at`);--> statement-breakpoint
CREATE TABLE `calculations` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`subsystem_slug` text NOT NULL,
	`season_id` text NOT NULL,
	`author_id` text,
	`notes` text DEFAULT '' NOT NULL,
	`inputs` text NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	`deleted_at` integer,
	FOREIGN KEY (`subsystem_slug`) REFERENCES `subsystems`(`slug`) ON UPDATE cascade ON DELETE no action,
	FOREIGN KEY (`season_id`) REFERENCES `seasons`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `calculations_subsystem_season_idx` ON `calculations` (`subsystem_slug`,`season_id`);--> statement-breakpoint
CREATE INDEX `calculations_kind_idx` ON `calculations` (`kind`);--> statement-breakpoint
CREATE TABLE `audit_entries` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`at` integer NOT NULL,
	`actor_id` text,
	`actor_label` text NOT NULL,
	`action` text NOT NULL,
	`target_type` text,
	`target_id` text,
	`detail` text,
	`ip` text,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `audit_entries_at_idx` ON `audit_entries` (`at`);--> statement-breakpoint
CREATE INDEX `audit_entries_action_idx` ON `audit_entries` (`action`);--> statement-breakpoint
CREATE TABLE `mail_messages` (
	`id` text PRIMARY KEY NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`transport` text NOT NULL,
	`status` text NOT NULL,
	`error` text,
	`sent_at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `mail_messages_sent_idx` ON `mail_messages` (`sent_at`);--> statement-breakpoint
CREATE TABLE `onboarding_items` (
	`id` text PRIMARY KEY NOT NULL,
	`subsystem_slug` text NOT NULL,
	`position` integer NOT NULL,
	`kind` text NOT NULL,
	`ref` text NOT NULL,
	`added_by_id` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`subsystem_slug`) REFERENCES `subsystems`(`slug`) ON UPDATE cascade ON DELETE cascade,
	FOREIGN KEY (`added_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `onboarding_items_ref` ON `onboarding_items` (`subsystem_slug`,`kind`,`ref`);--> statement-breakpoint
CREATE INDEX `onboarding_items_pos_idx` ON `onboarding_items` (`subsystem_slug`,`position`);--> statement-breakpoint
CREATE TABLE `onboarding_progress` (
	`user_id` text NOT NULL,
	`item_id` text NOT NULL,
	`done_at` integer NOT NULL,
	PRIMARY KEY(`user_id`, `item_id`),
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`item_id`) REFERENCES `onboarding_items`(`id`) ON UPDATE no action ON DELETE cascade
);
