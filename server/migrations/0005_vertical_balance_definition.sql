ALTER TABLE `maps` ADD `vertical_balance` text;--> statement-breakpoint
ALTER TABLE `runs` ADD `vertical_balance` text;