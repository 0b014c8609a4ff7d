/* Runs a command N times as whole processes and reports the median and minimum wall time and
 * the largest peak RSS, so benchmark sections measure what a user waits for.
 * usage: bench_run N LABEL CMD [ARGS...]   (stdout of CMD goes to /dev/null) */
#include <fcntl.h>
#include <stdio.h>
#include <stdlib.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <time.h>
#include <unistd.h>

static int cmp(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;
	return x < y ? -1 : x > y;
}

int main(int argc, char **argv)
{
	if (argc < 4) {
		fprintf(stderr, "usage: bench_run N LABEL CMD [ARGS...]\n");
		return 2;
	}
	int n = atoi(argv[1]);
	double *t = calloc((size_t)n, sizeof *t);
	long maxrss = 0;
	if (n < 1 || !t)
		return 2;
	for (int i = 0; i < n; i++) {
		struct timespec a, b;
		struct rusage ru;
		int status;
		clock_gettime(CLOCK_MONOTONIC, &a);
		pid_t pid = fork();
		if (pid == 0) {
			int fd = open("/dev/null", O_WRONLY);
			dup2(fd, 1);
			execvp(argv[3], argv + 3);
			_exit(127);
		}
		if (pid < 0 || wait4(pid, &status, 0, &ru) < 0) {
			perror("bench_run");
			return 1;
		}
		clock_gettime(CLOCK_MONOTONIC, &b);
		if (!WIFEXITED(status) || WEXITSTATUS(status)) {
			fprintf(stderr, "bench_run: %s exited with status %d\n", argv[3], WEXITSTATUS(status));
			return 1;
		}
		t[i] = (b.tv_sec - a.tv_sec) * 1e3 + (b.tv_nsec - a.tv_nsec) / 1e6;
		if (ru.ru_maxrss > maxrss)
			maxrss = ru.ru_maxrss;
	}
	qsort(t, (size_t)n, sizeof *t, cmp);
	printf("%-44s runs %3d  median %8.2f ms  min %8.2f ms  max RSS %6.1f MB\n", argv[2], n,
	       n % 2 ? t[n / 2] : (t[n / 2 - 1] + t[n / 2]) / 2, t[0], maxrss / 1024.0);
	free(t);
	return 0;
}
