/* Load units: 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959). */
#include "testutil.h"

#include "core/units.h"

static void exact_pound(void **state)
{
	(void)state;
	assert_near(units_lb_to_kg(1), 0.45359237, 0);
	assert_near(units_lb_to_kg(100), 45.359237, 1e-12);
	/* 100 kg = 100 / 0.45359237 lb = 220.462262185 lb (same agreement, 1959). */
	assert_near(units_kg_to_lb(100), 220.462262185, 1e-9);
	assert_near(units_kg_to_lb(units_lb_to_kg(315)), 315, 1e-12);
	assert_near(units_show(100, 0), 100, 0);
	assert_string_equal(units_name(1), "lb");
}

static void parse_loads(void **state)
{
	struct sd_err e = { 0 };
	double kg;
	(void)state;
	assert_int_equal(units_parse_load("100", 0, &kg, &e), 0);
	assert_near(kg, 100, 0);
	assert_int_equal(units_parse_load("100", 1, &kg, &e), 0);
	assert_near(kg, 45.359237, 1e-12);
	assert_int_equal(units_parse_load("225lb", 0, &kg, &e), 0);
	assert_near(kg, 225 * 0.45359237, 1e-12);
	assert_int_equal(units_parse_load("102.5 KG", 1, &kg, &e), 0);
	assert_near(kg, 102.5, 0);
	assert_int_equal(units_parse_load("-5", 0, &kg, &e), -1);
	assert_int_equal(e.code, SD_EXIT_USAGE);
	assert_int_equal(units_parse_load("0", 0, &kg, &e), -1);
	assert_int_equal(units_parse_load("abc", 0, &kg, &e), -1);
	assert_int_equal(units_parse_load("100 stone", 0, &kg, &e), -1);
	assert_int_equal(units_parse_load("nan", 0, &kg, &e), -1);
	assert_int_equal(units_parse_load("inf", 0, &kg, &e), -1);
	assert_int_equal(units_parse_load("5000", 0, &kg, &e), -1);
}

int main(void)
{
	const struct CMUnitTest tests[] = {
		cmocka_unit_test(exact_pound),
		cmocka_unit_test(parse_loads),
	};
	return cmocka_run_group_tests(tests, NULL, NULL);
}
