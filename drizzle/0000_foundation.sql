CREATE TABLE `api_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`code_id` int NOT NULL,
	`name` varchar(120) NOT NULL,
	`scope` enum('submit','read') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`prefix` varchar(16) NOT NULL,
	`demo_only` boolean NOT NULL DEFAULT false,
	`expires_at` timestamp(3),
	`revoked_at` timestamp(3),
	`last_used_at` timestamp(3),
	`created_by` int,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `api_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `api_tokens_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`user_id` int,
	`actor` varchar(254) NOT NULL,
	`action` varchar(60) NOT NULL,
	`object_type` varchar(40) NOT NULL,
	`object_id` varchar(64) NOT NULL,
	`detail` json NOT NULL,
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `case_results` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`run_id` int NOT NULL,
	`case_id` bigint,
	`line_number` int,
	`inputs` json,
	`measured` text,
	`abs_error` varchar(64),
	`rel_error` varchar(64),
	`ulps` varchar(64),
	`digits_agreed` varchar(16),
	`verdict` enum('pass','fail','missing','unexpected','non_finite','duplicate','accepted') NOT NULL,
	`decided_by` varchar(60) NOT NULL,
	`accepted_by_deviation_id` int,
	CONSTRAINT `case_results_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `cases` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`set_id` int NOT NULL,
	`ordinal` int NOT NULL,
	`inputs` json NOT NULL,
	`input_key` varchar(255) NOT NULL,
	`reference_value` text NOT NULL,
	`certified_digits` int NOT NULL,
	`condition_number` varchar(64),
	`region` varchar(60) NOT NULL DEFAULT 'all',
	`certification` varchar(120) NOT NULL,
	CONSTRAINT `cases_id` PRIMARY KEY(`id`),
	CONSTRAINT `cases_set_key_uq` UNIQUE(`set_id`,`input_key`)
);
--> statement-breakpoint
CREATE TABLE `code_owners` (
	`code_id` int NOT NULL,
	`user_id` int NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `code_owners_code_id_user_id_pk` PRIMARY KEY(`code_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `code_required_sets` (
	`code_id` int NOT NULL,
	`set_slug` varchar(80) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `code_required_sets_code_id_set_slug_pk` PRIMARY KEY(`code_id`,`set_slug`)
);
--> statement-breakpoint
CREATE TABLE `codes` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(64) NOT NULL,
	`name` varchar(160) NOT NULL,
	`team_id` int NOT NULL,
	`description` text NOT NULL,
	`language` varchar(60) NOT NULL DEFAULT '',
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `codes_id` PRIMARY KEY(`id`),
	CONSTRAINT `codes_slug_uq` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `deviations` (
	`id` int AUTO_INCREMENT NOT NULL,
	`code_id` int NOT NULL,
	`set_slug` varchar(80) NOT NULL,
	`scope` enum('case','region','set') NOT NULL,
	`case_input_key` varchar(255),
	`region` varchar(60),
	`reason` text NOT NULL,
	`state` enum('proposed','approved','rejected','withdrawn','expired') NOT NULL DEFAULT 'proposed',
	`proposed_by` int NOT NULL,
	`proposed_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`decided_by` int,
	`decided_at` timestamp(3),
	`decision_comment` text,
	`expires_at_version` varchar(100),
	`expires_on` datetime(3),
	CONSTRAINT `deviations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`kind` varchar(40) NOT NULL,
	`payload` json NOT NULL,
	`state` enum('queued','running','done','failed') NOT NULL DEFAULT 'queued',
	`progress` int NOT NULL DEFAULT 0,
	`total` int NOT NULL DEFAULT 0,
	`claimed_by` varchar(80),
	`claimed_at` timestamp(3),
	`error` text,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `jobs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `login_attempts` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`address` varchar(64) NOT NULL,
	`succeeded` boolean NOT NULL,
	`at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `login_attempts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`kind` varchar(40) NOT NULL,
	`to_address` varchar(254) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text NOT NULL,
	`state` enum('queued','sent','failed') NOT NULL DEFAULT 'queued',
	`attempts` int NOT NULL DEFAULT 0,
	`last_error` text,
	`next_attempt_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`sent_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `mail_outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reference_sets` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`revision` int NOT NULL DEFAULT 1,
	`name` varchar(160) NOT NULL,
	`function_id` varchar(40) NOT NULL,
	`convention` varchar(60) NOT NULL,
	`grid` json NOT NULL,
	`target_digits` int NOT NULL,
	`criterion` json NOT NULL,
	`source` text NOT NULL,
	`state` enum('draft','computing','ready','failed') NOT NULL DEFAULT 'draft',
	`case_count` int NOT NULL DEFAULT 0,
	`cases_done` int NOT NULL DEFAULT 0,
	`frozen_at` timestamp(3),
	`supersedes_id` int,
	`created_by` int,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `reference_sets_id` PRIMARY KEY(`id`),
	CONSTRAINT `reference_sets_slug_rev_uq` UNIQUE(`slug`,`revision`)
);
--> statement-breakpoint
CREATE TABLE `run_files` (
	`run_id` int NOT NULL,
	`content` longblob NOT NULL,
	CONSTRAINT `run_files_run_id` PRIMARY KEY(`run_id`)
);
--> statement-breakpoint
CREATE TABLE `runs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`version_id` int NOT NULL,
	`set_id` int NOT NULL,
	`submitted_by` int,
	`token_id` int,
	`file_name` varchar(255) NOT NULL,
	`file_sha256` char(64) NOT NULL,
	`file_size` int NOT NULL,
	`column_mapping` json NOT NULL,
	`counts` json NOT NULL,
	`max_rel_error` varchar(64),
	`median_rel_error` varchar(64),
	`rms_rel_error` varchar(64),
	`max_ulps` varchar(64),
	`worst_case_id` bigint,
	`regions` json NOT NULL,
	`is_regression` boolean NOT NULL DEFAULT false,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `runs_id` PRIMARY KEY(`id`),
	CONSTRAINT `runs_version_set_sha_uq` UNIQUE(`version_id`,`set_id`,`file_sha256`)
);
--> statement-breakpoint
CREATE TABLE `sign_offs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`version_id` int NOT NULL,
	`user_id` int NOT NULL,
	`kind` enum('sign','countersign') NOT NULL,
	`run_ids` json NOT NULL,
	`summary` json NOT NULL,
	`comment` text NOT NULL,
	`superseded_by_run_id` int,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sign_offs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `teams` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(64) NOT NULL,
	`name` varchar(160) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `teams_id` PRIMARY KEY(`id`),
	CONSTRAINT `teams_slug_uq` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `user_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`purpose` enum('invite','reset') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`expires_at` timestamp(3) NOT NULL,
	`used_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `user_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `user_tokens_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`role` enum('admin','qa','owner','viewer') NOT NULL,
	`password_hash` varchar(255),
	`disabled` boolean NOT NULL DEFAULT false,
	`password_changed_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_uq` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `versions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`code_id` int NOT NULL,
	`label` varchar(100) NOT NULL,
	`commit_id` varchar(64) NOT NULL DEFAULT '',
	`environment` json NOT NULL,
	`released_at` datetime(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `versions_id` PRIMARY KEY(`id`),
	CONSTRAINT `versions_code_label_uq` UNIQUE(`code_id`,`label`)
);
--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_code_id_codes_id_fk` FOREIGN KEY (`code_id`) REFERENCES `codes`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `case_results` ADD CONSTRAINT `case_results_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cases` ADD CONSTRAINT `cases_set_id_reference_sets_id_fk` FOREIGN KEY (`set_id`) REFERENCES `reference_sets`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `code_owners` ADD CONSTRAINT `code_owners_code_id_codes_id_fk` FOREIGN KEY (`code_id`) REFERENCES `codes`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `code_owners` ADD CONSTRAINT `code_owners_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `code_required_sets` ADD CONSTRAINT `code_required_sets_code_id_codes_id_fk` FOREIGN KEY (`code_id`) REFERENCES `codes`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `codes` ADD CONSTRAINT `codes_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deviations` ADD CONSTRAINT `deviations_code_id_codes_id_fk` FOREIGN KEY (`code_id`) REFERENCES `codes`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deviations` ADD CONSTRAINT `deviations_proposed_by_users_id_fk` FOREIGN KEY (`proposed_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deviations` ADD CONSTRAINT `deviations_decided_by_users_id_fk` FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reference_sets` ADD CONSTRAINT `reference_sets_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_files` ADD CONSTRAINT `run_files_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_version_id_versions_id_fk` FOREIGN KEY (`version_id`) REFERENCES `versions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_set_id_reference_sets_id_fk` FOREIGN KEY (`set_id`) REFERENCES `reference_sets`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_submitted_by_users_id_fk` FOREIGN KEY (`submitted_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_token_id_api_tokens_id_fk` FOREIGN KEY (`token_id`) REFERENCES `api_tokens`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sign_offs` ADD CONSTRAINT `sign_offs_version_id_versions_id_fk` FOREIGN KEY (`version_id`) REFERENCES `versions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sign_offs` ADD CONSTRAINT `sign_offs_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `user_tokens` ADD CONSTRAINT `user_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `versions` ADD CONSTRAINT `versions_code_id_codes_id_fk` FOREIGN KEY (`code_id`) REFERENCES `codes`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `audit_log_object_ix` ON `audit_log` (`object_type`,`object_id`);--> statement-breakpoint
CREATE INDEX `case_results_run_verdict_ix` ON `case_results` (`run_id`,`verdict`);--> statement-breakpoint
CREATE INDEX `case_results_case_ix` ON `case_results` (`case_id`);--> statement-breakpoint
CREATE INDEX `cases_set_ordinal_ix` ON `cases` (`set_id`,`ordinal`);--> statement-breakpoint
CREATE INDEX `deviations_code_set_ix` ON `deviations` (`code_id`,`set_slug`);--> statement-breakpoint
CREATE INDEX `jobs_state_ix` ON `jobs` (`state`,`id`);--> statement-breakpoint
CREATE INDEX `login_attempts_email_ix` ON `login_attempts` (`email`,`at`);--> statement-breakpoint
CREATE INDEX `login_attempts_address_ix` ON `login_attempts` (`address`,`at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_state_ix` ON `mail_outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `runs_set_ix` ON `runs` (`set_id`);--> statement-breakpoint
CREATE INDEX `sign_offs_version_ix` ON `sign_offs` (`version_id`);