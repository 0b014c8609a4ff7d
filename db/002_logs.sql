-- setdose schema, version 2: the training log, the sets an athlete actually did.
-- Applied by src/store/migrate.c inside one transaction after 001. Dates are ISO YYYY-MM-DD
-- text checked as real days, as in 001.
--
-- One row is one logged line: `sets` identical sets of `exercise` (the exercise library's
-- canonical name) on `log_date`, `reps` each (seconds when `timed`), with `load` in `unit` as
-- entered ('' and 0: no load, e.g. a bodyweight set) and the effort as reps in reserve
-- (`rir`, -1 when the log did not record one; `effort` keeps how it was written).
--
-- The same row twice: a row is identified by athlete, date, exercise, load, unit, reps,
-- timed, rir, sets and `ordinal`, its place among the identical rows of that athlete and
-- day in the file it came from (1 for the first). Re-importing a file, or an export that
-- overlaps what is stored, therefore adds nothing: every row meets its twin in the unique
-- index. Two identical sets logged as two rows on one day are two sets (ordinals 1 and 2).
-- `source` (file and line of the first import) is for the user only and not part of it.
--
-- The unique index is also the index by athlete and date (a block's span is read through it).
--
-- log_weeks holds the same sets summed per athlete, ISO week (its Monday), exercise and RIR,
-- with the days of the week they were logged on (bit d: day d, 0 Monday), so the weekly view
-- of years of logs reads one row per exercise and effort a week rather than every set. It is
-- derived: db_log_add keeps it in step in the same transaction, and `db recover` rebuilds it
-- from the rows of logs.

CREATE TABLE logs (
	id         INTEGER PRIMARY KEY,
	athlete_id INTEGER NOT NULL REFERENCES athletes(id) ON DELETE RESTRICT,
	log_date   TEXT NOT NULL CHECK (date(julianday(log_date)) IS log_date),
	exercise   TEXT NOT NULL CHECK (length(exercise) BETWEEN 1 AND 63),
	sets       INTEGER NOT NULL CHECK (sets BETWEEN 1 AND 100),
	reps       INTEGER NOT NULL CHECK (reps BETWEEN 1 AND 3600),
	timed      INTEGER NOT NULL DEFAULT 0 CHECK (timed IN (0, 1)),
	rir        REAL NOT NULL CHECK (rir = -1 OR rir BETWEEN 0 AND 10),
	effort     TEXT NOT NULL DEFAULT '' CHECK (length(effort) <= 15),
	load       REAL NOT NULL CHECK ((unit = '' AND load = 0) OR
	                                (unit IN ('kg', 'lb') AND load > 0 AND load <= 2205)),
	unit       TEXT NOT NULL,
	ordinal    INTEGER NOT NULL CHECK (ordinal >= 1),
	source     TEXT NOT NULL DEFAULT ''
);
CREATE UNIQUE INDEX logs_by_athlete ON logs(athlete_id, log_date, exercise, rir, sets, reps,
                                            timed, load, unit, ordinal);

CREATE TABLE log_weeks (
	athlete_id INTEGER NOT NULL REFERENCES athletes(id) ON DELETE RESTRICT,
	monday     TEXT NOT NULL CHECK (date(julianday(monday)) IS monday AND
	                            strftime('%w', monday) = '1'),
	exercise   TEXT NOT NULL,
	rir        REAL NOT NULL,
	sets       INTEGER NOT NULL CHECK (sets >= 1),
	days       INTEGER NOT NULL CHECK (days BETWEEN 1 AND 127),
	PRIMARY KEY (athlete_id, monday, exercise, rir)
) WITHOUT ROWID;
