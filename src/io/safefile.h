/* The one way setdose writes an output file (charts, reports, CSV, profiles, programs,
 * database backups): into a new temporary file in the target's folder, every write and the
 * final flush checked, fsync'ed, then renamed over the target and the folder fsync'ed.
 *
 * Contract:
 * - sf_open refuses, before anything is written: a folder that does not exist, a symbolic
 *   link at the target (never followed, even with force), a target that is not a regular file,
 *   and an existing file unless force.
 * - Until sf_commit succeeds the target is untouched; on every failure (sf_commit's own, or
 *   sf_abort by the caller) the temporary file is removed. SIGINT, SIGTERM and SIGHUP while a
 *   file is open remove it too; SIGXFSZ is ignored so a file-size limit is an ordinary write
 *   error.
 * - One file open at a time per process. A replaced file keeps its permission bits; a new
 *   one gets 0666 less the umask.
 * - Errors read "cannot write 'PATH': ..." or name the refusal plainly. */
#ifndef SD_SAFEFILE_H
#define SD_SAFEFILE_H

#include <stdio.h>

#include "../core/err.h"

struct sf_file {
	FILE *fp;          /* the temporary file: write through it (fprintf, fwrite, sf_sink) */
	char *target;      /* as given */
	char *tmp;         /* the temporary file's path (SQLite may write to it by name) */
	int force;
	int err;           /* first error (errno) seen by sf_sink, 0 if none */
};

/* Checks the target and creates the temporary file. On failure f needs no sf_abort. */
int sf_open(struct sf_file *f, const char *path, int force, struct sd_err *e);
/* Writes len bytes through f (a struct sf_file *): 0, or -1 after recording the error.
 * Its shape suits cairo's stream callbacks and other writers that take a sink. */
int sf_sink(void *f, const unsigned char *data, unsigned int len);
/* Flushes and checks every write, fsyncs, renames over the target, fsyncs the folder.
 * Returns 0 only when the file is in place; on failure the old file is intact and the
 * temporary file gone. Either way f is released. */
int sf_commit(struct sf_file *f, struct sd_err *e);
/* Ends a write whose content step returned rc: sf_commit when rc is 0, else sf_abort with e
 * naming the write error the sink saw (if it saw one) rather than the content step's echo of
 * it. Returns 0 only when the file is in place. */
int sf_finish(struct sf_file *f, int rc, struct sd_err *e);
/* Drops the temporary file, leaving the target as it was, and releases f. */
void sf_abort(struct sf_file *f);

#endif
