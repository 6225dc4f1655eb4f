# End-to-end tests of `coilfit size`, `parts`, `pick` and the program's exit codes.
set(rc_script ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set(ex ${COILFIT_EXAMPLES_DIR})
set(one_shot size --supply 12V --coil-resistance 400R --coil-voltage 12V --pin-vdd 3.3V
    --pin-max-current 8mA --transistor 2N4401 --diode 1N4148 --ambient-max 50C)

function(coilfit_cli_case name rc)
  cmake_parse_arguments(A "" "STDOUT_MATCH;STDERR_MATCH;STDERR_EXACT;INPUT;STDOUT_NOT_MATCH" "ARGS" ${ARGN})
  # Arguments travel joined by "|" (a list would be split by add_test); run_case splits them.
  string(REPLACE ";" "|" joined "${COILFIT_EXE};${A_ARGS}")
  set(defs "-DCMD=${joined}" -DRC=${rc})
  foreach(k STDOUT_MATCH STDERR_MATCH STDERR_EXACT INPUT STDOUT_NOT_MATCH)
    if(DEFINED A_${k})
      string(REPLACE ";" "\\;" value "${A_${k}}")
      list(APPEND defs "-D${k}=${value}")
    endif()
  endforeach()
  add_test(NAME cli.${name} COMMAND ${CMAKE_COMMAND} ${defs} -P ${rc_script})
  set_tests_properties(cli.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1")
endfunction()

coilfit_cli_case(version 0 ARGS --version STDOUT_MATCH "^coilfit [0-9]+\\.[0-9]+\\.[0-9]+")
coilfit_cli_case(help 0 ARGS --help STDOUT_MATCH "size")
coilfit_cli_case(size-help 0 ARGS size --help STDOUT_MATCH "--coil-resistance")
coilfit_cli_case(unknown-flag 2 ARGS size ${ex}/greenhouse-valve.json --suply 12V STDERR_MATCH "--suply")
coilfit_cli_case(no-spec 2 ARGS size
  STDERR_EXACT "coilfit: error: no spec: give a spec file (or - for standard input), or the spec fields as flags (see --help)")
coilfit_cli_case(missing-file 2 ARGS size nonexistent.json
  STDERR_EXACT "coilfit: error: nonexistent.json: cannot open the file")
coilfit_cli_case(bad-flag-unit 2 ARGS ${one_shot} --supply 12A
  STDERR_EXACT "coilfit: error: --supply: expected a voltage such as \"12V\", got \"12A\" (a current)")
coilfit_cli_case(one-shot-flags 0 ARGS ${one_shot} STDOUT_MATCH "Result: PASS")
coilfit_cli_case(one-shot-json 0 ARGS ${one_shot} --format json STDOUT_MATCH "\"verdict\": \"pass\"")
coilfit_cli_case(flag-overrides-file 1 ARGS size ${ex}/greenhouse-valve.json --pin-max-current 2mA
  STDOUT_MATCH "FAIL  pin.current +[0-9.]+ mA +2 mA ")
coilfit_cli_case(stdin 0 ARGS size - INPUT ${ex}/greenhouse-valve.json STDOUT_MATCH "greenhouse irrigation valve relay K2")
coilfit_cli_case(strict-warning-fails 1 ARGS size ${ex}/greenhouse-valve.json --forced-gain 20 --strict STDOUT_MATCH "WARN")
coilfit_cli_case(warning-passes 0 ARGS size ${ex}/greenhouse-valve.json --forced-gain 20 STDOUT_MATCH "PASS with 1 warning")
coilfit_cli_case(no-color-when-piped 0 ARGS size ${ex}/greenhouse-valve.json STDOUT_NOT_MATCH "\\x1b\\[")
coilfit_cli_case(bad-format 2 ARGS size ${ex}/greenhouse-valve.json --format xml STDERR_MATCH "format")
coilfit_cli_case(parts-json 0 ARGS parts --format json STDOUT_MATCH "\"transistors\": \\[")
coilfit_cli_case(parts-kind 0 ARGS parts zener STDOUT_MATCH "1N4749A")
coilfit_cli_case(parts-one 0 ARGS parts 2N4401 STDOUT_MATCH "Vceo +40 V")
coilfit_cli_case(parts-one-json 0 ARGS parts 2N4401 --format json STDOUT_MATCH "\"vceo\": 40")
coilfit_cli_case(parts-bad-path 2 ARGS parts --parts /nonexistent STDERR_EXACT "coilfit: error: /nonexistent: no such parts file or folder")
coilfit_cli_case(pick-passes 0 ARGS pick ${ex}/greenhouse-valve.json --top 3 STDOUT_MATCH "pass at worst case")
coilfit_cli_case(pick-json 0 ARGS pick ${ex}/greenhouse-valve.json --format json --top 2
  STDOUT_MATCH "\"candidates\": \\[.*\"worst_margin\"")
coilfit_cli_case(pick-nothing 1 ARGS pick ${ex}/garage-door.json --supply 6V STDOUT_MATCH "Nothing passes")
# The 4 mA pin of the garage door cannot drive a bipolar base, but a logic-level MOSFET passes.
coilfit_cli_case(pick-garage-door-mosfet 0 ARGS pick ${ex}/garage-door.json --format json
  STDOUT_MATCH "\"driver\": \"nmos\",[^}]*\"gate_resistor_ohm\": [0-9.]+,[^}]*\"verdict\": \"pass\"")

# --output writes the report whole; a failed run leaves no file behind.
add_test(NAME cli.output-atomic
  COMMAND ${CMAKE_COMMAND} -DEXE=${COILFIT_EXE} -DEX=${ex} -DOUT=${CMAKE_CURRENT_BINARY_DIR}/output-test
          -P ${CMAKE_CURRENT_SOURCE_DIR}/cli_output_check.cmake.in)
set_tests_properties(cli.output-atomic PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")

# A part run beyond its highest Vce(sat) and hFE points: the checks warn (pass), --strict fails them.
set(beyond ${CMAKE_CURRENT_SOURCE_DIR}/data/beyond_data.json)
coilfit_cli_case(beyond-data-warns 0 ARGS size ${beyond} STDOUT_MATCH "beyond the part's data")
coilfit_cli_case(beyond-data-strict 1 ARGS size ${beyond} --strict STDOUT_MATCH "WARN")
coilfit_cli_case(beyond-data-json 0 ARGS size ${beyond} --format json STDOUT_MATCH "\"beyond_data\": true")
