/* The one list of commands, in the order `setdose help` shows them. */
#include "cmd.h"

#include <string.h>

extern const struct sd_cmd cmd_audit, cmd_curve, cmd_returns, cmd_exercises, cmd_profile,
	cmd_chart, cmd_report, cmd_help;
extern const struct sd_cmd cmd_athlete, cmd_program, cmd_block, cmd_test, cmd_e1rm, cmd_response,
	cmd_db, cmd_log;
extern const struct sd_cmd cmd_effects, cmd_fit, cmd_slopes;
extern const struct sd_cmd cmd_browse, cmd_complete;
extern const struct sd_cmd cmd_compare, cmd_allot;

const struct sd_cmd *const sd_commands[] = {
	&cmd_audit,
	&cmd_compare,
	&cmd_curve,
	&cmd_returns,
	&cmd_allot,
	&cmd_exercises,
	&cmd_profile,
	&cmd_chart,
	&cmd_report,
	&cmd_athlete,
	&cmd_program,
	&cmd_block,
	&cmd_test,
	&cmd_e1rm,
	&cmd_log,
	&cmd_response,
	&cmd_db,
	&cmd_effects,
	&cmd_fit,
	&cmd_slopes,
	&cmd_browse,
	&cmd_help,
	&cmd_complete,
	NULL,
};

const struct sd_cmd *cmd_find(const char *name, struct sd_err *e)
{
	const struct sd_cmd *hit = NULL;
	char list[256] = "";
	size_t len = strlen(name);
	int nhit = 0;

	for (int i = 0; sd_commands[i]; i++) {
		const struct sd_cmd *c = sd_commands[i];
		if (!strcmp(c->name, name) || (c->alias && !strcmp(c->alias, name)))
			return c;
	}
	for (int i = 0; len && sd_commands[i]; i++) {
		const struct sd_cmd *c = sd_commands[i];
		if (strncmp(c->name, name, len))
			continue;
		hit = c;
		nhit++;
		if (strlen(list) + strlen(c->name) + 3 < sizeof list)
			strcat(strcat(list, nhit > 1 ? ", " : ""), c->name);
	}
	if (nhit == 1)
		return hit;
	if (nhit > 1)
		sd_usage(e, "ambiguous command '%s': could be %s", name, list);
	else
		sd_usage(e, "unknown command '%s' (see 'setdose help')", name);
	return NULL;
}
