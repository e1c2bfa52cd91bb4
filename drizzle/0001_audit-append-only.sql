-- The audit trail is append-only: the database itself refuses to change or remove an entry.
CREATE TRIGGER `audit_log_no_update` BEFORE UPDATE ON `audit_log` FOR EACH ROW
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only: entries cannot be updated';
--> statement-breakpoint
CREATE TRIGGER `audit_log_no_delete` BEFORE DELETE ON `audit_log` FOR EACH ROW
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only: entries cannot be deleted';
--> statement-breakpoint
CREATE TRIGGER `sign_offs_no_delete` BEFORE DELETE ON `sign_offs` FOR EACH ROW
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'sign_offs is append-only: signatures cannot be deleted';
