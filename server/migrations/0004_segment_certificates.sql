CREATE TABLE `segment_certificates` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`run_id` integer NOT NULL,
	`from_index` integer NOT NULL,
	`to_index` integer NOT NULL,
	`r_min` real NOT NULL,
	`r_max` real NOT NULL,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `segment_certificates_run_from_unique` ON `segment_certificates` (`run_id`,`from_index`);