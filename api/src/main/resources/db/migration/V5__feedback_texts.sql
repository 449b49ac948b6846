-- What training needs of an agent's feedback, and what the library offers a manager.
-- suggestion_feedback already held the question (cleaned) and, for an edited answer, the text
-- sent (final_text); an accepted answer's text was not kept, and a group's text changes with the
-- next generation. suggested_text is the suggestion's text as the agent saw it (redacted): for
-- an accepted answer, the text sent. proposed: the agent offered the edited text as the answer's
-- next version in the library. Plain SQL that H2 and PostgreSQL both run; IF NOT EXISTS as in V2.
ALTER TABLE suggestion_feedback ADD COLUMN IF NOT EXISTS suggested_text VARCHAR(100000);
ALTER TABLE suggestion_feedback ADD COLUMN IF NOT EXISTS proposed BOOLEAN DEFAULT FALSE NOT NULL;
-- An incoming ticket's own fields (JSON, values redacted as the question is), from which an
-- answer's slots are filled where DIR/slot-fields.properties names a field for each.
ALTER TABLE queue_ticket ADD COLUMN IF NOT EXISTS fields VARCHAR(100000);
