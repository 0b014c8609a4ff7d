#include "safefile.h"

#include <errno.h>
#include <fcntl.h>
#include <limits.h>
#include <signal.h>
#include <stdlib.h>
#include <string.h>
#include <sys/random.h>
#include <sys/stat.h>
#include <time.h>
#include <unistd.h>

/* The temporary file of the open sf_file, for the signal handler (one open file at a time). */
static char live_tmp[PATH_MAX];
static volatile sig_atomic_t live;

static const int caught[] = { SIGINT, SIGTERM, SIGHUP };
#define NCAUGHT (int)(sizeof caught / sizeof caught[0])
static struct sigaction saved[NCAUGHT], saved_xfsz;
static int installed[NCAUGHT];

/* Removes the half-written file, then lets the signal do what it would have done. */
static void on_signal(int sig)
{
	int keep = errno;
	if (live)
		unlink(live_tmp);
	live = 0;
	signal(sig, SIG_DFL);
	raise(sig);
	errno = keep;
}

static void guard(const char *tmp)
{
	struct sigaction sa;

	snprintf(live_tmp, sizeof live_tmp, "%s", tmp);
	live = 1;
	memset(&sa, 0, sizeof sa);
	sigemptyset(&sa.sa_mask);
	sa.sa_handler = on_signal;
	for (int i = 0; i < NCAUGHT; i++) {
		struct sigaction old;
		installed[i] = 0;
		/* A signal the caller ignores (a background job's SIGINT) stays ignored. */
		if (sigaction(caught[i], NULL, &old) || old.sa_handler == SIG_IGN)
			continue;
		if (!sigaction(caught[i], &sa, &saved[i]))
			installed[i] = 1;
	}
	sa.sa_handler = SIG_IGN;
	sigaction(SIGXFSZ, &sa, &saved_xfsz);
}

static void unguard(void)
{
	for (int i = 0; i < NCAUGHT; i++)
		if (installed[i])
			sigaction(caught[i], &saved[i], NULL);
	sigaction(SIGXFSZ, &saved_xfsz, NULL);
	live = 0;
}

/* The folder holding path ("." for a bare name); malloc'd. */
static char *folder_of(const char *path)
{
	const char *slash = strrchr(path, '/');
	if (!slash)
		return strdup(".");
	if (slash == path)
		return strdup("/");
	return strndup(path, (size_t)(slash - path));
}

static int check_target(const char *path, int force, const char *dir, mode_t *mode,
			struct sd_err *e)
{
	struct stat st;

	if (stat(dir, &st)) {
		if (errno == ENOENT)
			return sd_fail(e, "folder '%s' does not exist", dir);
		return sd_fail(e, "cannot write '%s': folder '%s': %s", path, dir, strerror(errno));
	}
	if (!S_ISDIR(st.st_mode))
		return sd_fail(e, "cannot write '%s': '%s' is not a folder", path, dir);
	if (lstat(path, &st)) {
		if (errno != ENOENT)
			return sd_fail(e, "cannot write '%s': %s", path, strerror(errno));
		*mode = 0;
		return 0;
	}
	if (S_ISLNK(st.st_mode))
		return sd_fail(e, "'%s' is a symbolic link; setdose does not write through links "
			       "(name the file itself)", path);
	if (S_ISDIR(st.st_mode))
		return sd_fail(e, "'%s' is a folder, not a file", path);
	if (!S_ISREG(st.st_mode))
		return sd_fail(e, "'%s' is not a regular file; setdose writes only regular files", path);
	if (!force)
		return sd_fail(e, "'%s' exists; choose another file or add --force", path);
	*mode = st.st_mode & 07777;
	return 0;
}

/* Creates a new file beside the target: ".NAME.setdose-XXXXXXXX", never an existing one. */
static int create_tmp(struct sf_file *f, const char *dir, mode_t mode, struct sd_err *e)
{
	const char *slash = strrchr(f->target, '/'), *base = slash ? slash + 1 : f->target;
	size_t n = strlen(dir) + strlen(base) + 40;
	int fd = -1;

	if (!(f->tmp = malloc(n)))
		return sd_fail(e, "out of memory");
	for (int tries = 0; tries < 100 && fd < 0; tries++) {
		unsigned int r;
		if (getrandom(&r, sizeof r, GRND_NONBLOCK) != (ssize_t)sizeof r)
			r = (unsigned int)getpid() * 2654435761u ^ (unsigned int)clock() ^ (unsigned int)tries;
		/* The name is cut to keep within NAME_MAX; the folder decides where it goes. */
		snprintf(f->tmp, n, "%s/.%.200s.setdose-%08x", dir, base, r);
		fd = open(f->tmp, O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC | O_NOFOLLOW, 0666);
		if (fd < 0 && errno != EEXIST)
			break;
	}
	if (fd < 0)
		return sd_fail(e, "cannot write '%s': %s", f->target, strerror(errno));
	guard(f->tmp);
	if (mode)
		fchmod(fd, mode);   /* a replaced file keeps its permissions */
	if (!(f->fp = fdopen(fd, "w"))) {
		int err = errno;
		close(fd);
		unlink(f->tmp);
		unguard();
		return sd_fail(e, "cannot write '%s': %s", f->target, strerror(err));
	}
	return 0;
}

static void release(struct sf_file *f)
{
	free(f->target);
	free(f->tmp);
	memset(f, 0, sizeof *f);
}

int sf_open(struct sf_file *f, const char *path, int force, struct sd_err *e)
{
	char *dir = NULL;
	mode_t mode = 0;
	int rc = -1;

	memset(f, 0, sizeof *f);
	if (!path || !*path)
		return sd_usage(e, "empty output file name");
	if (path[strlen(path) - 1] == '/')
		return sd_fail(e, "'%s' names a folder, not a file", path);
	f->force = force;
	if (!(f->target = strdup(path)) || !(dir = folder_of(path))) {
		sd_fail(e, "out of memory");
		goto done;
	}
	if (check_target(path, force, dir, &mode, e) || create_tmp(f, dir, mode, e))
		goto done;
	rc = 0;
done:
	free(dir);
	if (rc)
		release(f);
	return rc;
}

int sf_sink(void *arg, const unsigned char *data, unsigned int len)
{
	struct sf_file *f = arg;
	if (f->err)
		return -1;
	if (len && fwrite(data, 1, len, f->fp) != len) {
		f->err = errno ? errno : EIO;
		return -1;
	}
	return 0;
}

void sf_abort(struct sf_file *f)
{
	if (f->fp)
		fclose(f->fp);
	if (f->tmp)
		unlink(f->tmp);
	if (f->tmp)
		unguard();
	release(f);
}

/* Puts tmp in place of target: never over an existing file unless force. */
static int put_in_place(struct sf_file *f, struct sd_err *e)
{
	struct stat st;

	if (f->force) {
		if (!lstat(f->target, &st) && S_ISLNK(st.st_mode))
			return sd_fail(e, "'%s' is a symbolic link; setdose does not write through "
				       "links (name the file itself)", f->target);
		if (rename(f->tmp, f->target))
			return sd_fail(e, "cannot write '%s': %s", f->target, strerror(errno));
		return 0;
	}
	/* Atomic "create, never replace": the file may have appeared since sf_open. */
	if (!renameat2(AT_FDCWD, f->tmp, AT_FDCWD, f->target, RENAME_NOREPLACE))
		return 0;
	if (errno == EEXIST)
		return sd_fail(e, "'%s' exists; choose another file or add --force", f->target);
	if (errno != EINVAL && errno != ENOSYS)
		return sd_fail(e, "cannot write '%s': %s", f->target, strerror(errno));
	/* A file system without renameat2 flags: a hard link fails on an existing name too. */
	if (!link(f->tmp, f->target)) {
		unlink(f->tmp);
		return 0;
	}
	if (errno == EEXIST)
		return sd_fail(e, "'%s' exists; choose another file or add --force", f->target);
	if (lstat(f->target, &st) == 0)
		return sd_fail(e, "'%s' exists; choose another file or add --force", f->target);
	if (rename(f->tmp, f->target))
		return sd_fail(e, "cannot write '%s': %s", f->target, strerror(errno));
	return 0;
}

/* The rename is only durable once the folder's entry is on disk. */
static int sync_folder(const char *target, struct sd_err *e)
{
	char *dir = folder_of(target);
	int fd, rc = 0;

	if (!dir)
		return sd_fail(e, "out of memory");
	fd = open(dir, O_RDONLY | O_DIRECTORY | O_CLOEXEC);
	/* Some file systems cannot fsync a folder (EINVAL): the file is in place regardless. */
	if (fd < 0 || (fsync(fd) && errno != EINVAL && errno != EROFS))
		rc = sd_fail(e, "wrote '%s' but cannot sync its folder '%s': %s", target, dir,
			     strerror(errno));
	if (fd >= 0)
		close(fd);
	free(dir);
	return rc;
}

int sf_commit(struct sf_file *f, struct sd_err *e)
{
	int err = f->err, rc = -1;

	if (!err && (fflush(f->fp) || ferror(f->fp)))
		err = errno ? errno : EIO;
	if (!err && fsync(fileno(f->fp)))
		err = errno;
	if (fclose(f->fp) && !err)
		err = errno ? errno : EIO;
	f->fp = NULL;
	if (err) {
		sd_fail(e, "cannot write '%s': %s", f->target, strerror(err));
		goto done;
	}
	if (put_in_place(f, e))
		goto done;
	unguard();
	rc = sync_folder(f->target, e);
	release(f);
	return rc;
done:
	unlink(f->tmp);
	unguard();
	release(f);
	return rc;
}

int sf_finish(struct sf_file *f, int rc, struct sd_err *e)
{
	if (!rc)
		return sf_commit(f, e);
	if (f->err)
		sd_fail(e, "cannot write '%s': %s", f->target, strerror(f->err));
	sf_abort(f);
	return -1;
}
