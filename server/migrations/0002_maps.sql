CREATE TABLE `maps` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`project_id` integer NOT NULL,
	`graph_version_id` integer NOT NULL,
	`name` text NOT NULL,
	`plane` text NOT NULL,
	`settings` text NOT NULL,
	`result` text NOT NULL,
	`cell_count` integer NOT NULL,
	`solved_count` integer NOT NULL,
	`wall_ms` real,
	`workers` integer,
	`verification` text DEFAULT 'pending' NOT NULL,
	`verification_reason` text,
	`app_version` text NOT NULL,
	`author_id` integer,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`graph_version_id`) REFERENCES `graph_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `maps_project_idx` ON `maps` (`project_id`);