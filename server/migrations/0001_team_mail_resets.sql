CREATE TABLE `password_resets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `password_resets_token_hash_unique` ON `password_resets` (`token_hash`);--> statement-breakpoint
CREATE INDEX `password_resets_user_idx` ON `password_resets` (`user_id`);--> statement-breakpoint
ALTER TABLE `mail_messages` ADD `from_address` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_messages` ADD `kind` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_messages` ADD `message_id` text;--> statement-breakpoint
ALTER TABLE `mail_messages` ADD `attempts` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_messages` ADD `next_attempt_at` integer;--> statement-breakpoint
ALTER TABLE `mail_messages` ADD `sent_at` integer;--> statement-breakpoint
CREATE INDEX `mail_messages_status_idx` ON `mail_messages` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE UNIQUE INDEX `mail_messages_message_id_unique` ON `mail_messages` (`message_id`);