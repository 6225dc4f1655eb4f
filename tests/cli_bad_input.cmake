# Bad input end to end: the program exits 2 and the first line of stderr is exactly
# "coilfit: error: " and one line naming the file (or flag), the field and what was expected.
# The files live in tests/data/bad_input; the cases run there so that messages name them short.
set(bad_input_dir ${CMAKE_CURRENT_SOURCE_DIR}/data/bad_input)

function(coilfit_bad_input name expected_line)
  cmake_parse_arguments(A "" "INPUT" "ARGS" ${ARGN})
  string(REPLACE ";" "|" joined "${COILFIT_EXE};${A_ARGS}")
  string(REPLACE ";" "\\;" expected_line "${expected_line}")
  set(defs "-DCMD=${joined}" -DRC=2 "-DSTDERR_EXACT=${expected_line}" "-DWORKDIR=${bad_input_dir}")
  if(DEFINED A_INPUT)
    list(APPEND defs "-DINPUT=${bad_input_dir}/${A_INPUT}")
  endif()
  add_test(NAME cli.bad-input.${name} COMMAND ${CMAKE_COMMAND} ${defs} -P ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
  set_tests_properties(cli.bad-input.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1")
endfunction()

coilfit_bad_input(empty-file
  "coilfit: error: empty.json: the file is empty; expected a JSON object { \"schema\": \"coilfit.spec/1\", ... }"
  ARGS size empty.json)
coilfit_bad_input(not-an-object
  "coilfit: error: list.json: expected a JSON object { \"schema\": \"coilfit.spec/1\", ... }, got a list"
  ARGS size list.json)
coilfit_bad_input(binary-garbage-on-stdin
  "coilfit: error: <stdin>:1:1: not valid JSON: invalid literal"
  ARGS size - INPUT garbage.bin)
coilfit_bad_input(unknown-key
  "coilfit: error: unknown-key.json: suply: unknown key (expected one of: ambient, base_resistor, clamp, coil, gate_resistor, load, name, pin, policy, pulldown, relay, schema, supply, switching, transistor)"
  ARGS size unknown-key.json)
coilfit_bad_input(unknown-schema
  "coilfit: error: unknown-schema.json: schema: expected \"coilfit.spec/1\" (the schema this coilfit reads), got \"coilfit.spec/2\""
  ARGS size unknown-schema.json)
coilfit_bad_input(deeply-nested
  "coilfit: error: deep.json: nested deeper than 64 levels"
  ARGS size deep.json)
coilfit_bad_input(number-overflow
  "coilfit: error: overflow.json:1:54: not valid JSON: the number 1e400 is out of range"
  ARGS size overflow.json)
coilfit_bad_input(negative-resistance-flag
  "coilfit: error: --coil-resistance: expected a resistance greater than zero, got -3 Ω"
  ARGS size lab-valve.json --coil-resistance=-3R)
coilfit_bad_input(tolerance-flag-plain-number
  "coilfit: error: --supply-tolerance: expected a ratio from 0 % to 50 %, got 1000 % (a plain number is a fraction: write \"10%\" or 0.1)"
  ARGS size lab-valve.json --supply-tolerance 10)
coilfit_bad_input(bad-parts-table-rejected-whole
  "coilfit: error: bad-table.json: [1].vrrm: expected a voltage greater than zero, got -100 V"
  ARGS size lab-valve.json --parts bad-table.json)
coilfit_bad_input(pick-bad-input
  "coilfit: error: --ambient-min: expected at most ambient.max 40.0 °C, got 60.0 °C"
  ARGS pick lab-valve.json --ambient-min 60C)
coilfit_bad_input(flags-only-names-the-missing-flag
  "coilfit: error: command line: coil.rated_voltage: missing; expected a voltage such as \"12V\" (give --coil-voltage)"
  ARGS size --supply 12V --coil-resistance 400R)
coilfit_bad_input(flags-only-missing-section
  "coilfit: error: command line: supply.voltage: missing; expected a voltage such as \"12V\" (give --supply)"
  ARGS size --coil-resistance 400R)

# Hostile input (issue 17): what would mislead when echoed raw is shown escaped (\u202e, \u00a0,
# \u200b), bidi controls are refused in names, lengths count characters (201 two-byte "é").
coilfit_bad_input(bidi-name-in-spec
  "coilfit: error: bidi-name.json: name: expected a text without bidirectional controls, got \"lab valve \\u202eV3\""
  ARGS size bidi-name.json)
coilfit_bad_input(bidi-name-flag
  "coilfit: error: --name: expected a text without bidirectional controls, got \"K2\\u202e evil\""
  ARGS size lab-valve.json "--name=K2‮ evil")
coilfit_bad_input(no-break-space-in-value
  "coilfit: error: --supply: expected a voltage such as \"12V\", got \"24\\u00a0V\""
  ARGS size lab-valve.json "--supply=24 V")
coilfit_bad_input(zero-width-space-in-id
  "coilfit: error: invisible-id.json: [0].id: expected an id without invisible characters, got \"DT1\\u200b\""
  ARGS size lab-valve.json --parts invisible-id.json)
coilfit_bad_input(name-length-in-characters
  "coilfit: error: --name: expected a text of at most 200 characters, got 201"
  ARGS size lab-valve.json "--name=ééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééééé")
