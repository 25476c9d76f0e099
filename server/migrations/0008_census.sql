CREATE TABLE `census_jobs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`status` text DEFAULT 'queued' NOT NULL,
	`queue` text NOT NULL,
	`max_towers` integer NOT NULL,
	`max_half_edges` integer NOT NULL,
	`options` text DEFAULT '{}' NOT NULL,
	`visited` integer DEFAULT 0 NOT NULL,
	`found` integer DEFAULT 0 NOT NULL,
	`classified` integer DEFAULT 0 NOT NULL,
	`error` text,
	`created_by` integer,
	`finished_at` integer,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE TABLE `census_patterns` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`code` text NOT NULL,
	`mirror_code` text NOT NULL,
	`chiral` integer NOT NULL,
	`towers` integer NOT NULL,
	`edges` integer NOT NULL,
	`half_edges` integer NOT NULL,
	`faces` integer NOT NULL,
	`degrees` text NOT NULL,
	`face_sizes` text NOT NULL,
	`predicted_genus` integer NOT NULL,
	`automorphisms` integer NOT NULL,
	`balanced` integer NOT NULL,
	`reason` text,
	`rigid` integer,
	`phase_kernel_dimension` integer,
	`tau` text NOT NULL,
	`failing` text NOT NULL,
	`document` text NOT NULL,
	`job_id` integer,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `census_jobs`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `census_patterns_code_unique` ON `census_patterns` (`code`);--> statement-breakpoint
CREATE INDEX `census_patterns_towers_idx` ON `census_patterns` (`towers`,`predicted_genus`);