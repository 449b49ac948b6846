-- Claims with leases, so that several replicas of the service can share one queue (PostgreSQL).
-- A claim names its owner (the replica's id, precedent.replica.id) and the moment its lease ends;
-- a claim whose lease has ended is taken by whichever replica claims next. Plain SQL that H2 and
-- PostgreSQL both run; IF NOT EXISTS because V1's baseline rule (ServiceSchema) may run this over
-- a database that already has the columns.
ALTER TABLE queue_ticket ADD COLUMN IF NOT EXISTS claim_owner VARCHAR(100);
ALTER TABLE queue_ticket ADD COLUMN IF NOT EXISTS lease_until TIMESTAMP WITH TIME ZONE;
CREATE INDEX IF NOT EXISTS queue_ticket_lease ON queue_ticket(status, lease_until);
-- What every replica must have in force: the thresholds (as JSON) and the model version. A change
-- through any replica writes its row in the transaction of its audit record and counts a revision;
-- every replica reads the rows each precedent.shared.poll-ms and puts a newer revision in force.
CREATE TABLE IF NOT EXISTS shared_in_force (
  name VARCHAR(40) NOT NULL PRIMARY KEY,
  content VARCHAR(1000000) NOT NULL,
  revision BIGINT NOT NULL,
  changed_at TIMESTAMP WITH TIME ZONE NOT NULL
);
