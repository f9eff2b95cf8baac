ALTER TABLE `athletes` ADD `aliases` text DEFAULT '[]' NOT NULL;--> statement-breakpoint
ALTER TABLE `tests` ADD `aliases` text DEFAULT '[]' NOT NULL;