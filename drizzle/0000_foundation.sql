CREATE TABLE `api_keys` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`name` varchar(100) NOT NULL,
	`prefix` varchar(24) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`last_four` varchar(4) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`secret_hash` char(64) NOT NULL,
	`scopes` json NOT NULL,
	`created_by_user_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3),
	`last_used_at` datetime(3),
	`revoked_at` datetime(3),
	CONSTRAINT `api_keys_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `audit_events` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`actor_type` enum('user','api_key') NOT NULL,
	`actor_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`actor_label` varchar(100) NOT NULL,
	`action` varchar(64) NOT NULL,
	`object_type` varchar(32) NOT NULL,
	`object_id` varchar(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`details` json NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `audit_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `memberships` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`user_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`role` enum('owner','admin','analyst','viewer') NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `memberships_id` PRIMARY KEY(`id`),
	CONSTRAINT `memberships_organisation_user_unique` UNIQUE(`organisation_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `organisations` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`name` varchar(100) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `organisations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`email` varchar(254) NOT NULL,
	`display_name` varchar(100) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_failures` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`account_key` char(64) NOT NULL,
	`client_address` varchar(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `sign_in_failures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `api_keys` ADD CONSTRAINT `api_keys_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `api_keys` ADD CONSTRAINT `api_keys_created_by_user_id_users_id_fk` FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `memberships` ADD CONSTRAINT `memberships_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `memberships` ADD CONSTRAINT `memberships_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `api_keys_prefix_idx` ON `api_keys` (`prefix`);--> statement-breakpoint
CREATE INDEX `api_keys_organisation_created_idx` ON `api_keys` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `audit_events_organisation_created_idx` ON `audit_events` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `audit_events_organisation_object_idx` ON `audit_events` (`organisation_id`,`object_id`);--> statement-breakpoint
CREATE INDEX `memberships_user_idx` ON `memberships` (`user_id`);--> statement-breakpoint
CREATE INDEX `sign_in_failures_account_idx` ON `sign_in_failures` (`account_key`,`created_at`);--> statement-breakpoint
CREATE INDEX `sign_in_failures_address_idx` ON `sign_in_failures` (`client_address`,`created_at`);