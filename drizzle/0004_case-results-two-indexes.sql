DROP INDEX `case_results_run_region_ix` ON `case_results`;--> statement-breakpoint
DROP INDEX `case_results_run_rel_ix` ON `case_results`;