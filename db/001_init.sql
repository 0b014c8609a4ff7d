-- setdose schema, version 1: athletes, program templates, training blocks, strength tests.
-- Applied by src/store/migrate.c inside one transaction; the file's number is its version.
-- Dates are ISO YYYY-MM-DD text, checked as real days (date(julianday(x)) normalises 02-30 to
-- 03-01, so only a real date equals itself); loads are kilograms.

CREATE TABLE athletes (
	id       INTEGER PRIMARY KEY,
	name     TEXT NOT NULL UNIQUE COLLATE NOCASE CHECK (length(name) BETWEEN 1 AND 63),
	status   TEXT NOT NULL CHECK (status IN ('trained', 'untrained')),
	units    TEXT NOT NULL DEFAULT 'kg' CHECK (units IN ('kg', 'lb')),
	notes    TEXT NOT NULL DEFAULT '',
	created  TEXT NOT NULL DEFAULT (strftime('%Y-%m-%d %H:%M:%S', 'now'))
);

-- The template's source is kept as a BLOB so it comes back byte for byte.
CREATE TABLE programs (
	id       INTEGER PRIMARY KEY,
	name     TEXT NOT NULL UNIQUE COLLATE NOCASE CHECK (length(name) BETWEEN 1 AND 127),
	format   TEXT NOT NULL CHECK (format IN ('ini', 'csv')),
	source   BLOB NOT NULL,
	created  TEXT NOT NULL DEFAULT (strftime('%Y-%m-%d %H:%M:%S', 'now'))
);

CREATE TABLE blocks (
	id         INTEGER PRIMARY KEY,
	athlete_id INTEGER NOT NULL REFERENCES athletes(id) ON DELETE RESTRICT,
	program_id INTEGER NOT NULL REFERENCES programs(id) ON DELETE RESTRICT,
	start_date TEXT NOT NULL CHECK (date(julianday(start_date)) IS start_date),
	weeks      INTEGER NOT NULL CHECK (weeks BETWEEN 1 AND 104),
	end_date   TEXT CHECK (end_date IS NULL
	                       OR (date(julianday(end_date)) IS end_date AND end_date >= start_date))
);
CREATE INDEX blocks_by_athlete ON blocks(athlete_id, start_date);
CREATE INDEX blocks_by_program ON blocks(program_id);
CREATE INDEX blocks_open ON blocks(athlete_id) WHERE end_date IS NULL;

CREATE TABLE tests (
	id         INTEGER PRIMARY KEY,
	athlete_id INTEGER NOT NULL REFERENCES athletes(id) ON DELETE RESTRICT,
	lift       TEXT NOT NULL CHECK (length(lift) BETWEEN 1 AND 63),
	test_date  TEXT NOT NULL CHECK (date(julianday(test_date)) IS test_date),
	load_kg    REAL NOT NULL CHECK (load_kg > 0),
	reps       INTEGER NOT NULL CHECK (reps BETWEEN 1 AND 20),
	e1rm_kg    REAL NOT NULL CHECK (e1rm_kg >= load_kg),
	formula    TEXT NOT NULL
);
CREATE INDEX tests_by_athlete ON tests(athlete_id, lift, test_date);
