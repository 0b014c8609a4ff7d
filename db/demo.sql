-- setdose demo database: the invented gym "Tidewater Strength Co-op".
-- EVERYTHING HERE IS INVENTED: the gym, the athletes, their notes and every number.
-- No real people and no real data. The strength-test numbers were made up as
--   post 1RM = pre 1RM x exp(bundled curve's prediction + an invented personal offset
--              + invented noise, SD 0.03), loads rounded to 2.5 kg (5 lb for lb athletes),
-- so that 'setdose response' has something to show. Loads are in kg, as stored.
--
-- Load it into a scratch database after the three demo templates (tests/demo_db.sh does both):
--   setdose --db DEMO.db program add profiles/demo-*.ini
--   sqlite3 DEMO.db < db/demo.sql
-- Blocks and tests name their athlete and template, so ids need not be known. tests/demo_db.sh
-- then adds the athletes' invented training log (written by tests/demo_logs.awk).

BEGIN;

INSERT INTO athletes (name, status, units, notes) VALUES ('Maren Oakhollow', 'trained', 'kg', 'competes in local meets; invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Tobin Reedmere', 'trained', 'lb', 'trains early mornings; invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Ilse Brackwater', 'untrained', 'kg', 'new member; invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Juno Saltmarsh', 'untrained', 'kg', 'rowing background; invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Caspian Hollowell', 'trained', 'kg', 'shift worker, short sleep; invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Wren Alderly', 'untrained', 'kg', 'invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Otto Vantwell', 'trained', 'lb', 'masters lifter; invented demo athlete');
INSERT INTO athletes (name, status, units, notes) VALUES ('Sefa Northcote', 'untrained', 'kg', 'invented demo athlete');

-- Maren Oakhollow (trained): 2 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-19', 8, '2026-03-16' FROM athletes a, programs p WHERE a.name = 'Maren Oakhollow' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-03-23', 10, '2026-06-01' FROM athletes a, programs p WHERE a.name = 'Maren Oakhollow' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-06-08', 12 FROM athletes a, programs p WHERE a.name = 'Maren Oakhollow' AND p.name = 'Tidewater minimal, two days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-16', 132.500000, 3, 140.294118, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-01-17', 150.000000, 5, 168.750000, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-18', 82.500000, 5, 92.812500, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-14', 105.000000, 3, 111.176471, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-14', 215.000000, 1, 215.000000, 'tested' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-16', 165.000000, 3, 174.705882, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-20', 152.500000, 5, 171.562500, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-20', 110.000000, 1, 110.000000, 'tested' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-22', 200.000000, 3, 211.764706, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-05-30', 252.500000, 3, 267.352941, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-06-01', 202.500000, 3, 214.411765, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-06-01', 120.000000, 5, 135.000000, 'brzycki' FROM athletes WHERE name = 'Maren Oakhollow';

-- Tobin Reedmere (trained): 2 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-05', 10, '2026-03-16' FROM athletes a, programs p WHERE a.name = 'Tobin Reedmere' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-03-23', 8, '2026-05-18' FROM athletes a, programs p WHERE a.name = 'Tobin Reedmere' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-05-25', 8 FROM athletes a, programs p WHERE a.name = 'Tobin Reedmere' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-01-03', 176.901024, 5, 199.013652, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-04', 156.489368, 3, 165.694625, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-04', 111.130131, 3, 117.667197, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-14', 181.436948, 3, 192.109710, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-15', 124.737902, 3, 132.075425, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-16', 204.116567, 5, 229.631137, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-21', 131.541787, 1, 131.541787, 'tested' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-22', 170.097139, 5, 191.359281, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-22', 226.796185, 1, 226.796185, 'tested' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-05-16', 215.456376, 1, 215.456376, 'tested' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-05-16', 263.083575, 1, 263.083575, 'tested' FROM athletes WHERE name = 'Tobin Reedmere';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-05-18', 133.809749, 5, 150.535968, 'brzycki' FROM athletes WHERE name = 'Tobin Reedmere';

-- Ilse Brackwater (untrained): 2 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-12', 12, '2026-04-06' FROM athletes a, programs p WHERE a.name = 'Ilse Brackwater' AND p.name = 'Tidewater minimal, two days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-04-13', 10, '2026-06-22' FROM athletes a, programs p WHERE a.name = 'Ilse Brackwater' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-06-29', 10 FROM athletes a, programs p WHERE a.name = 'Ilse Brackwater' AND p.name = 'Tidewater full body, three days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-10', 60.000000, 1, 60.000000, 'tested' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-10', 37.500000, 3, 39.705882, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-04-05', 50.000000, 3, 52.941176, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-04-06', 75.000000, 3, 79.411765, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-04-10', 75.000000, 3, 79.411765, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-04-11', 50.000000, 3, 52.941176, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-06-20', 92.500000, 5, 104.062500, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-06-20', 60.000000, 5, 67.500000, 'brzycki' FROM athletes WHERE name = 'Ilse Brackwater';

-- Juno Saltmarsh (untrained): 2 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-05', 10, '2026-03-16' FROM athletes a, programs p WHERE a.name = 'Juno Saltmarsh' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-03-23', 10, '2026-06-01' FROM athletes a, programs p WHERE a.name = 'Juno Saltmarsh' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-06-08', 8 FROM athletes a, programs p WHERE a.name = 'Juno Saltmarsh' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-02', 75.000000, 3, 79.411765, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-03', 52.500000, 3, 55.588235, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-01-03', 32.500000, 3, 34.411765, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-14', 62.500000, 3, 66.176471, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-15', 100.000000, 1, 100.000000, 'tested' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-03-16', 37.500000, 3, 39.705882, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-20', 87.500000, 5, 98.437500, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-20', 57.500000, 5, 64.687500, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-03-20', 40.000000, 1, 40.000000, 'tested' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-05-30', 112.500000, 3, 119.117647, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-05-30', 50.000000, 1, 50.000000, 'tested' FROM athletes WHERE name = 'Juno Saltmarsh';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-05-31', 77.500000, 3, 82.058824, 'brzycki' FROM athletes WHERE name = 'Juno Saltmarsh';

-- Caspian Hollowell (trained): 3 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-19', 8, '2026-03-16' FROM athletes a, programs p WHERE a.name = 'Caspian Hollowell' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-03-23', 8, '2026-05-18' FROM athletes a, programs p WHERE a.name = 'Caspian Hollowell' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-05-25', 8, '2026-07-20' FROM athletes a, programs p WHERE a.name = 'Caspian Hollowell' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-07-27', 10 FROM athletes a, programs p WHERE a.name = 'Caspian Hollowell' AND p.name = 'Tidewater full body, three days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-01-16', 212.500000, 3, 225.000000, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-17', 165.000000, 5, 185.625000, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-18', 115.000000, 5, 129.375000, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-14', 137.500000, 3, 145.588235, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-14', 215.000000, 5, 241.875000, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-16', 192.500000, 3, 203.823529, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-21', 190.000000, 3, 201.176471, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-21', 240.000000, 1, 240.000000, 'tested' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-22', 135.000000, 3, 142.941176, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-05-16', 237.500000, 5, 267.187500, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-05-17', 207.500000, 3, 219.705882, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-05-18', 147.500000, 3, 156.176471, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-05-23', 205.000000, 3, 217.058824, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-05-23', 235.000000, 5, 264.375000, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-05-24', 145.000000, 3, 153.529412, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-07-19', 160.000000, 3, 169.411765, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-07-19', 285.000000, 1, 285.000000, 'tested' FROM athletes WHERE name = 'Caspian Hollowell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-07-20', 222.500000, 3, 235.588235, 'brzycki' FROM athletes WHERE name = 'Caspian Hollowell';

-- Wren Alderly (untrained): 2 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-12', 12, '2026-04-06' FROM athletes a, programs p WHERE a.name = 'Wren Alderly' AND p.name = 'Tidewater minimal, two days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-04-13', 12, '2026-07-06' FROM athletes a, programs p WHERE a.name = 'Wren Alderly' AND p.name = 'Tidewater minimal, two days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-07-13', 10 FROM athletes a, programs p WHERE a.name = 'Wren Alderly' AND p.name = 'Tidewater full body, three days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-09', 50.000000, 5, 56.250000, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-09', 32.500000, 3, 34.411765, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-01-11', 70.000000, 1, 70.000000, 'tested' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-04-05', 75.000000, 3, 79.411765, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-04-05', 42.500000, 5, 47.812500, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-04-06', 87.500000, 3, 92.647059, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-04-10', 42.500000, 5, 47.812500, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-04-11', 75.000000, 3, 79.411765, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-04-12', 82.500000, 5, 92.812500, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-07-04', 60.000000, 3, 63.529412, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-07-05', 107.500000, 5, 120.937500, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-07-06', 92.500000, 5, 104.062500, 'brzycki' FROM athletes WHERE name = 'Wren Alderly';

-- Otto Vantwell (trained): 3 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-19', 10, '2026-03-30' FROM athletes a, programs p WHERE a.name = 'Otto Vantwell' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-04-06', 12, '2026-06-29' FROM athletes a, programs p WHERE a.name = 'Otto Vantwell' AND p.name = 'Tidewater minimal, two days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-07-06', 8, '2026-08-31' FROM athletes a, programs p WHERE a.name = 'Otto Vantwell' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-09-07', 12 FROM athletes a, programs p WHERE a.name = 'Otto Vantwell' AND p.name = 'Tidewater minimal, two days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-16', 133.809749, 5, 150.535968, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-17', 104.326245, 1, 104.326245, 'tested' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-01-17', 58.967008, 3, 62.435656, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-01-18', 165.561215, 5, 186.256367, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-29', 113.398093, 3, 120.068569, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-29', 201.848605, 5, 227.079680, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-03-29', 70.306817, 3, 74.442512, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-30', 172.365101, 1, 172.365101, 'tested' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-04-03', 70.306817, 3, 74.442512, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-04-04', 224.528223, 1, 224.528223, 'tested' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-04-05', 151.953444, 5, 170.947624, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-04-05', 117.934016, 1, 117.934016, 'tested' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-06-27', 79.378665, 5, 89.300998, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-06-28', 172.365101, 5, 193.910738, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-06-28', 251.743765, 3, 266.552222, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-06-29', 136.077711, 3, 144.082282, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-07-03', 133.809749, 3, 141.680911, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-07-03', 79.378665, 5, 89.300998, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-07-04', 233.600071, 5, 262.800079, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-07-05', 192.776757, 1, 192.776757, 'tested' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-08-29', 154.221406, 3, 163.293253, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-08-29', 285.763193, 3, 302.572793, 'brzycki' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'overhead press', '2026-08-30', 99.790321, 1, 99.790321, 'tested' FROM athletes WHERE name = 'Otto Vantwell';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-08-31', 219.992299, 1, 219.992299, 'tested' FROM athletes WHERE name = 'Otto Vantwell';

-- Sefa Northcote (untrained): 2 completed blocks, one open
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-01-19', 10, '2026-03-30' FROM athletes a, programs p WHERE a.name = 'Sefa Northcote' AND p.name = 'Tidewater full body, three days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks, end_date) SELECT a.id, p.id, '2026-04-06', 8, '2026-06-01' FROM athletes a, programs p WHERE a.name = 'Sefa Northcote' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO blocks (athlete_id, program_id, start_date, weeks) SELECT a.id, p.id, '2026-06-08', 8 FROM athletes a, programs p WHERE a.name = 'Sefa Northcote' AND p.name = 'Tidewater upper/lower, four days';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-01-16', 52.500000, 5, 59.062500, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-01-17', 105.000000, 3, 111.176471, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-01-18', 90.000000, 1, 90.000000, 'tested' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-03-28', 127.500000, 5, 143.437500, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-03-30', 115.000000, 1, 115.000000, 'tested' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-03-30', 72.500000, 3, 76.764706, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-04-03', 100.000000, 5, 112.500000, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-04-05', 72.500000, 3, 76.764706, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-04-05', 135.000000, 3, 142.941176, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'bench press', '2026-05-30', 92.500000, 3, 97.941176, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'deadlift', '2026-05-30', 172.500000, 3, 182.647059, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';
INSERT INTO tests (athlete_id, lift, test_date, load_kg, reps, e1rm_kg, formula) SELECT id, 'back squat', '2026-06-01', 132.500000, 5, 149.062500, 'brzycki' FROM athletes WHERE name = 'Sefa Northcote';

COMMIT;
