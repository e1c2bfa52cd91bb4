ALTER TABLE `case_results` ADD `region` varchar(60);--> statement-breakpoint
ALTER TABLE `case_results` ADD `rel_error_key` double;--> statement-breakpoint
ALTER TABLE `case_results` ADD `abs_error_key` double;--> statement-breakpoint
ALTER TABLE `case_results` ADD `ulps_key` double;--> statement-breakpoint
ALTER TABLE `reference_sets` ADD `notes` text DEFAULT ('') NOT NULL;--> statement-breakpoint
ALTER TABLE `reference_sets` ADD `output` varchar(40) DEFAULT 'value' NOT NULL;--> statement-breakpoint
ALTER TABLE `reference_sets` ADD `error` text;--> statement-breakpoint
CREATE INDEX `case_results_run_region_ix` ON `case_results` (`run_id`,`region`);--> statement-breakpoint
CREATE INDEX `case_results_run_rel_ix` ON `case_results` (`run_id`,`rel_error_key`);