/* The safe writer (io/safefile.h): what it refuses, what it leaves behind on failure, and the
 * permissions of what it writes. Write errors come from a file-size limit (RLIMIT_FSIZE);
 * the command-line tests repeat this on a full file system. */
#include "testutil.h"

#include <dirent.h>
#include <errno.h>
#include <signal.h>
#include <stdlib.h>
#include <string.h>
#include <sys/resource.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "io/safefile.h"

static char dir[256];

static int setup(void **state)
{
	(void)state;
	snprintf(dir, sizeof dir, "/tmp/sd_safefile_XXXXXX");
	return mkdtemp(dir) ? 0 : -1;
}

static int teardown(void **state)
{
	char cmd[300];
	(void)state;
	snprintf(cmd, sizeof cmd, "rm -rf '%s'", dir);
	return system(cmd);
}

static void path_of(char *buf, size_t n, const char *name)
{
	snprintf(buf, n, "%s/%s", dir, name);
}

static void put(const char *path, const char *text)
{
	FILE *f = fopen(path, "w");
	assert_non_null(f);
	fputs(text, f);
	assert_int_equal(fclose(f), 0);
}

static char *slurp(const char *path)
{
	static char buf[4096];
	FILE *f = fopen(path, "r");
	size_t n;
	if (!f)
		return NULL;
	n = fread(buf, 1, sizeof buf - 1, f);
	buf[n] = '\0';
	fclose(f);
	return buf;
}

/* Entries of the folder, to check no temporary file is left. */
static int entries(void)
{
	DIR *d = opendir(dir);
	struct dirent *de;
	int n = 0;
	assert_non_null(d);
	while ((de = readdir(d)))
		n += strcmp(de->d_name, ".") && strcmp(de->d_name, "..");
	closedir(d);
	return n;
}

static void writes_new_file(void **state)
{
	char p[300];
	struct sf_file f;
	struct sd_err e = { 0 };
	struct stat st;
	mode_t um = umask(022);
	(void)state;
	path_of(p, sizeof p, "new.csv");
	assert_int_equal(sf_open(&f, p, 0, &e), 0);
	fprintf(f.fp, "a,b\n1,2\n");
	assert_int_equal(sf_commit(&f, &e), 0);
	assert_string_equal(slurp(p), "a,b\n1,2\n");
	assert_int_equal(stat(p, &st), 0);
	assert_int_equal(st.st_mode & 0777, 0644);   /* 0666 less the umask */
	assert_int_equal(entries(), 1);
	umask(um);
	unlink(p);
}

static void refuses_existing_and_links(void **state)
{
	char p[300], target[300], link[300], sub[300];
	struct sf_file f;
	struct sd_err e = { 0 };
	struct stat st;
	(void)state;
	path_of(p, sizeof p, "old.ini");
	put(p, "old\n");
	chmod(p, 0600);
	assert_int_equal(sf_open(&f, p, 0, &e), -1);
	assert_non_null(strstr(e.msg, "exists; choose another file or add --force"));
	/* --force replaces it and keeps its permissions. */
	assert_int_equal(sf_open(&f, p, 1, &e), 0);
	fputs("new\n", f.fp);
	assert_int_equal(sf_commit(&f, &e), 0);
	assert_string_equal(slurp(p), "new\n");
	assert_int_equal(stat(p, &st), 0);
	assert_int_equal(st.st_mode & 0777, 0600);
	/* A symbolic link is never written through, with or without --force. */
	path_of(target, sizeof target, "target.txt");
	path_of(link, sizeof link, "link.png");
	put(target, "keep\n");
	assert_int_equal(symlink(target, link), 0);
	for (int force = 0; force <= 1; force++) {
		assert_int_equal(sf_open(&f, link, force, &e), -1);
		assert_non_null(strstr(e.msg, "is a symbolic link"));
	}
	assert_string_equal(slurp(target), "keep\n");
	/* A dangling link too: creating its target would be writing through it. */
	unlink(target);
	assert_int_equal(sf_open(&f, link, 1, &e), -1);
	assert_int_equal(access(target, F_OK), -1);
	/* A folder, a missing folder, a file used as a folder. */
	path_of(sub, sizeof sub, "sub");
	assert_int_equal(mkdir(sub, 0700), 0);
	assert_int_equal(sf_open(&f, sub, 1, &e), -1);
	assert_non_null(strstr(e.msg, "is a folder, not a file"));
	path_of(sub, sizeof sub, "missing/x.pdf");
	assert_int_equal(sf_open(&f, sub, 0, &e), -1);
	char want[400];
	snprintf(want, sizeof want, "folder '%s/missing' does not exist", dir);
	assert_string_equal(e.msg, want);
	path_of(sub, sizeof sub, "old.ini/x.pdf");
	assert_int_equal(sf_open(&f, sub, 0, &e), -1);
	assert_non_null(strstr(e.msg, "is not a folder"));
	assert_int_equal(sf_open(&f, "", 0, &e), -1);
	assert_int_equal(e.code, SD_EXIT_USAGE);
	unlink(link);
	unlink(p);
	path_of(sub, sizeof sub, "sub");
	rmdir(sub);
	assert_int_equal(entries(), 0);
}

static void failure_leaves_old_file(void **state)
{
	char p[300], big[65536];
	struct sf_file f;
	struct sd_err e = { 0 };
	struct rlimit old, lim;
	(void)state;
	path_of(p, sizeof p, "keep.pdf");
	put(p, "the old report\n");
	/* The content step fails: the old file stays, the temporary file goes. */
	assert_int_equal(sf_open(&f, p, 1, &e), 0);
	fputs("half", f.fp);
	assert_int_equal(sf_finish(&f, sd_fail(&e, "cannot draw"), &e), -1);
	assert_string_equal(e.msg, "cannot draw");
	assert_string_equal(slurp(p), "the old report\n");
	assert_int_equal(entries(), 1);
	/* A write error (file-size limit: EFBIG, with SIGXFSZ ignored while writing). */
	assert_int_equal(getrlimit(RLIMIT_FSIZE, &old), 0);
	lim = old;
	lim.rlim_cur = 4096;
	assert_int_equal(setrlimit(RLIMIT_FSIZE, &lim), 0);
	memset(big, 'x', sizeof big);
	assert_int_equal(sf_open(&f, p, 1, &e), 0);
	/* Through the stream, as fprintf writers do: the error is only seen at the end. */
	for (int i = 0; i < 100; i++)
		fprintf(f.fp, "%.*s\n", 99, big);
	assert_int_equal(sf_commit(&f, &e), -1);
	assert_int_equal(setrlimit(RLIMIT_FSIZE, &old), 0);
	assert_non_null(strstr(e.msg, "cannot write"));
	assert_non_null(strstr(e.msg, strerror(EFBIG)));
	assert_string_equal(slurp(p), "the old report\n");
	assert_int_equal(entries(), 1);
	/* sf_sink records the first error and sf_finish reports it. */
	assert_int_equal(setrlimit(RLIMIT_FSIZE, &lim), 0);
	assert_int_equal(sf_open(&f, p, 1, &e), 0);
	int failed = 0;
	for (int i = 0; i < 4 && !failed; i++)
		failed = sf_sink(&f, (const unsigned char *)big, sizeof big) != 0;
	assert_true(failed);
	assert_int_equal(sf_finish(&f, -1, &e), -1);
	assert_int_equal(setrlimit(RLIMIT_FSIZE, &old), 0);
	assert_non_null(strstr(e.msg, strerror(EFBIG)));
	assert_string_equal(slurp(p), "the old report\n");
	assert_int_equal(entries(), 1);
	/* The signal dispositions are back as they were. */
	struct sigaction sa;
	assert_int_equal(sigaction(SIGXFSZ, NULL, &sa), 0);
	assert_true(sa.sa_handler == SIG_DFL);
	assert_int_equal(sigaction(SIGINT, NULL, &sa), 0);
	assert_true(sa.sa_handler == SIG_DFL);
	unlink(p);
}

/* A file that appears between sf_open and sf_commit is not replaced without --force. */
static void race_keeps_new_file(void **state)
{
	char p[300];
	struct sf_file f;
	struct sd_err e = { 0 };
	(void)state;
	path_of(p, sizeof p, "late.svg");
	assert_int_equal(sf_open(&f, p, 0, &e), 0);
	fputs("mine", f.fp);
	put(p, "someone else's\n");
	assert_int_equal(sf_commit(&f, &e), -1);
	assert_non_null(strstr(e.msg, "exists"));
	assert_string_equal(slurp(p), "someone else's\n");
	assert_int_equal(entries(), 1);
	unlink(p);
}

/* Ctrl-C while a file is being written: the temporary file goes, the old file stays. */
static void signal_removes_temporary(void **state)
{
	char p[300];
	int status;
	pid_t pid;
	(void)state;
	path_of(p, sizeof p, "interrupted.csv");
	put(p, "before\n");
	pid = fork();
	assert_true(pid >= 0);
	if (pid == 0) {
		struct sf_file f;
		struct sd_err e = { 0 };
		if (sf_open(&f, p, 1, &e))
			_exit(3);
		fputs("half written", f.fp);
		fflush(f.fp);
		raise(SIGINT);
		_exit(4);   /* not reached: SIGINT ends the process after the cleanup */
	}
	assert_int_equal(waitpid(pid, &status, 0), pid);
	assert_true(WIFSIGNALED(status));
	assert_int_equal(WTERMSIG(status), SIGINT);
	assert_string_equal(slurp(p), "before\n");
	assert_int_equal(entries(), 1);
	unlink(p);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(writes_new_file),
		cmocka_unit_test(refuses_existing_and_links),
		cmocka_unit_test(failure_leaves_old_file),
		cmocka_unit_test(race_keeps_new_file),
		cmocka_unit_test(signal_removes_temporary),
	};
	return cmocka_run_group_tests(tests, setup, teardown);
}
