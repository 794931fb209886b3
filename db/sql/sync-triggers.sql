-- Benchwright sync: change capture by SQLite triggers.
-- Every synced row has one line in change_log holding the server-wide version of its latest change
-- (AUTOINCREMENT: increasing, never reused). A change moves the row's line to a new version, so a pull
-- "since version N" is one index range scan. Every writer (counter actions, seed, sync push) is captured.
-- tickets.version (the header version devices edit from) is bumped by one on every ticket update.
-- A ticket entering or leaving the working set (open <-> closed, or another machine/customer) re-logs
-- its machine and customer; a reopened ticket also re-logs its bench facts, so devices get them again.
-- Closed statuses here must match CLOSED_STATUSES in lib/tickets/status.ts (a test checks it).
-- Keep this file and the custom migration db/migrations/*_sync_triggers.sql identical (a test checks it).
CREATE TRIGGER sync_machines_insert AFTER INSERT ON machines
BEGIN
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_machines_update AFTER UPDATE ON machines
BEGIN
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_machines_delete AFTER DELETE ON machines
BEGIN
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_customers_insert AFTER INSERT ON customers
BEGIN
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_customers_update AFTER UPDATE ON customers
BEGIN
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_customers_delete AFTER DELETE ON customers
BEGIN
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_procedures_insert AFTER INSERT ON procedures
BEGIN
  DELETE FROM change_log WHERE entity = 'procedure' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('procedure', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_procedures_update AFTER UPDATE ON procedures
BEGIN
  DELETE FROM change_log WHERE entity = 'procedure' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('procedure', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_procedures_delete AFTER DELETE ON procedures
BEGIN
  DELETE FROM change_log WHERE entity = 'procedure' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('procedure', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_bench_entries_insert AFTER INSERT ON bench_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'bench_entry' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('bench_entry', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_bench_entries_update AFTER UPDATE ON bench_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'bench_entry' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('bench_entry', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_bench_entries_delete AFTER DELETE ON bench_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'bench_entry' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('bench_entry', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_findings_insert AFTER INSERT ON findings
BEGIN
  DELETE FROM change_log WHERE entity = 'finding' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('finding', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_findings_update AFTER UPDATE ON findings
BEGIN
  DELETE FROM change_log WHERE entity = 'finding' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('finding', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_findings_delete AFTER DELETE ON findings
BEGIN
  DELETE FROM change_log WHERE entity = 'finding' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('finding', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tune_entries_insert AFTER INSERT ON tune_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'tune_entry' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('tune_entry', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tune_entries_update AFTER UPDATE ON tune_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'tune_entry' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('tune_entry', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tune_entries_delete AFTER DELETE ON tune_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'tune_entry' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('tune_entry', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_photos_insert AFTER INSERT ON photos
BEGIN
  DELETE FROM change_log WHERE entity = 'photo' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('photo', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_photos_update AFTER UPDATE ON photos
BEGIN
  DELETE FROM change_log WHERE entity = 'photo' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('photo', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_photos_delete AFTER DELETE ON photos
BEGIN
  DELETE FROM change_log WHERE entity = 'photo' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('photo', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_labor_entries_insert AFTER INSERT ON labor_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'labor_entry' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('labor_entry', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_labor_entries_update AFTER UPDATE ON labor_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'labor_entry' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('labor_entry', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_labor_entries_delete AFTER DELETE ON labor_entries
BEGIN
  DELETE FROM change_log WHERE entity = 'labor_entry' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('labor_entry', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_ticket_notes_insert AFTER INSERT ON ticket_notes
BEGIN
  DELETE FROM change_log WHERE entity = 'ticket_note' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('ticket_note', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_ticket_notes_update AFTER UPDATE ON ticket_notes
BEGIN
  DELETE FROM change_log WHERE entity = 'ticket_note' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('ticket_note', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_ticket_notes_delete AFTER DELETE ON ticket_notes
BEGIN
  DELETE FROM change_log WHERE entity = 'ticket_note' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('ticket_note', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_parts_used_insert AFTER INSERT ON parts_used
BEGIN
  DELETE FROM change_log WHERE entity = 'part_used' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('part_used', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_parts_used_update AFTER UPDATE ON parts_used
BEGIN
  DELETE FROM change_log WHERE entity = 'part_used' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('part_used', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_parts_used_delete AFTER DELETE ON parts_used
BEGIN
  DELETE FROM change_log WHERE entity = 'part_used' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('part_used', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tickets_insert AFTER INSERT ON tickets
BEGIN
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = NEW.machine_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', NEW.machine_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = NEW.customer_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', NEW.customer_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'ticket' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('ticket', NEW.id, 'insert', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tickets_bump_version AFTER UPDATE ON tickets WHEN NEW.version = OLD.version
BEGIN
  UPDATE tickets SET version = OLD.version + 1 WHERE id = NEW.id;
END;
--> statement-breakpoint
CREATE TRIGGER sync_tickets_update AFTER UPDATE ON tickets WHEN NEW.version <> OLD.version
BEGIN
  DELETE FROM change_log WHERE entity = 'ticket' AND entity_id = NEW.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('ticket', NEW.id, 'update', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tickets_working_set AFTER UPDATE ON tickets WHEN (OLD.status IN ('handed_back', 'returned_unrepaired')) <> (NEW.status IN ('handed_back', 'returned_unrepaired'))
  OR OLD.machine_id <> NEW.machine_id OR OLD.customer_id <> NEW.customer_id
BEGIN
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = OLD.machine_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', OLD.machine_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = OLD.customer_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', OLD.customer_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = NEW.machine_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', NEW.machine_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = NEW.customer_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', NEW.customer_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
END;
--> statement-breakpoint
CREATE TRIGGER sync_tickets_reopened AFTER UPDATE ON tickets WHEN OLD.status IN ('handed_back', 'returned_unrepaired') AND NEW.status NOT IN ('handed_back', 'returned_unrepaired')
BEGIN
  DELETE FROM change_log WHERE entity = 'bench_entry' AND entity_id IN (SELECT id FROM bench_entries WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'bench_entry', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM bench_entries WHERE ticket_id = NEW.id;
  DELETE FROM change_log WHERE entity = 'finding' AND entity_id IN (SELECT id FROM findings WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'finding', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM findings WHERE ticket_id = NEW.id;
  DELETE FROM change_log WHERE entity = 'tune_entry' AND entity_id IN (SELECT id FROM tune_entries WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'tune_entry', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM tune_entries WHERE ticket_id = NEW.id;
  DELETE FROM change_log WHERE entity = 'photo' AND entity_id IN (SELECT id FROM photos WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'photo', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM photos WHERE ticket_id = NEW.id;
  DELETE FROM change_log WHERE entity = 'labor_entry' AND entity_id IN (SELECT id FROM labor_entries WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'labor_entry', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM labor_entries WHERE ticket_id = NEW.id;
  DELETE FROM change_log WHERE entity = 'ticket_note' AND entity_id IN (SELECT id FROM ticket_notes WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'ticket_note', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM ticket_notes WHERE ticket_id = NEW.id;
  DELETE FROM change_log WHERE entity = 'part_used' AND entity_id IN (SELECT id FROM parts_used WHERE ticket_id = NEW.id);
  INSERT INTO change_log (entity, entity_id, op, at) SELECT 'part_used', id, 'touch', cast(unixepoch('subsecond') * 1000 as integer) FROM parts_used WHERE ticket_id = NEW.id;
END;
--> statement-breakpoint
CREATE TRIGGER sync_tickets_delete AFTER DELETE ON tickets
BEGIN
  DELETE FROM change_log WHERE entity = 'ticket' AND entity_id = OLD.id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('ticket', OLD.id, 'delete', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'machine' AND entity_id = OLD.machine_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('machine', OLD.machine_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
  DELETE FROM change_log WHERE entity = 'customer' AND entity_id = OLD.customer_id;
  INSERT INTO change_log (entity, entity_id, op, at) VALUES ('customer', OLD.customer_id, 'touch', cast(unixepoch('subsecond') * 1000 as integer));
END;
