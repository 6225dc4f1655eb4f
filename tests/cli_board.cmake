# coilfit board end to end: the example boards, the options, and a table of bad board files whose
# first line of stderr is pinned exactly ("coilfit: error: FILE: FIELD: what was expected").
set(run_case ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set(board_ex ${COILFIT_EXAMPLES_DIR}/irrigation-board.json)
set(board_ex_max_on ${COILFIT_EXAMPLES_DIR}/irrigation-board-max-on.json)

function(coilfit_board_case name rc)
  cmake_parse_arguments(A "" "" "ARGS;DEFS" ${ARGN})
  string(REPLACE ";" "|" joined "${COILFIT_EXE};board;${A_ARGS}")
  add_test(NAME cli.board.${name} COMMAND ${CMAKE_COMMAND} "-DCMD=${joined}" -DRC=${rc} ${A_DEFS} -P ${run_case})
  set_tests_properties(cli.board.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1;COLUMNS=100")
endfunction()

# Every channel on: the port budget fails (8 pins on PA), though every channel passes on its own.
coilfit_board_case(port-budget-fails 1 ARGS ${board_ex}
  DEFS "-DSTDOUT_MATCH=port\\.current +port PA +13\\.9 mA +12 mA +-16 % +FAIL +all 8 channels.*Result: FAIL: 1 board check failed \\(every channel passes on its own\\): port\\.current \\(port PA\\)\\.")
# At most three relays on: the worst set for the port is the pump and two zones, and it passes.
coilfit_board_case(max-on-passes 0 ARGS ${board_ex_max_on}
  DEFS "-DSTDOUT_MATCH=port\\.current +port PA +8\\.63 mA +12 mA +\\+28 % +pass +K1 pump and 2 of K2-K8 zones.*Result: PASS")
# The array package's checks are taken at the three zones (the pump is not on it).
coilfit_board_case(array-set 0 ARGS ${board_ex_max_on}
  DEFS "-DSTDOUT_MATCH=array\\.power +array U3 .* pass +3 of K2-K8 zones")
coilfit_board_case(one-line-per-channel 1 ARGS ${board_ex}
  DEFS "-DSTDOUT_MATCH=K1 pump +PA0 +2N4401 +470 Ω .*K2-K8 zones #7 +PA7 +array-7ch-darlington-50v \\(U3\\) +built in")
coilfit_board_case(cautions-once 1 ARGS ${board_ex}
  DEFS "-DSTDOUT_MATCH=Cautions\n  ! figures are worst-case estimates" "-DSTDOUT_NOT_MATCH=worst-case estimates.*worst-case estimates")
coilfit_board_case(json 1 ARGS ${board_ex} --format json
  DEFS "-DSTDOUT_MATCH=\"schema\": \"coilfit.board-report/1\",\n  \"tool\": {\n    \"name\": \"coilfit\".*\"id\": \"port.current\",\n      \"verdict\": \"fail\".*\"subject\": \"port PA\",\n      \"set\": \\[.*\"report\": {\n        \"schema\": \"coilfit.report/1\"")
coilfit_board_case(brief 1 ARGS ${board_ex} --brief
  DEFS "-DSTDOUT_MATCH=Board checks that fail or warn\n.*port\\.current.*Cautions.*Result: FAIL" "-DSTDOUT_NOT_MATCH=What fails or warns|package\\.current|Notes")
coilfit_board_case(channel-report 0 ARGS ${board_ex} --channel PA3
  DEFS "-DSTDOUT_MATCH=coilfit [^\n]* - K2-K8 zones #3\n.*Result: PASS")
coilfit_board_case(channel-by-name-json 0 ARGS ${board_ex} --channel "K1 pump" --format json
  DEFS "-DSTDOUT_MATCH=\"schema\": \"coilfit.report/1\".*\"name\": \"K1 pump\"")
coilfit_board_case(stdin 0 ARGS - DEFS "-DINPUT=${board_ex_max_on}" "-DSTDOUT_MATCH=Result: PASS")
# A warning (a channel beyond its array's input data) passes, but fails with --strict.
coilfit_board_case(warning-passes 0 ARGS ${CMAKE_CURRENT_SOURCE_DIR}/data/board_warn.json DEFS "-DSTDOUT_MATCH=Result: PASS with 1 warning")
coilfit_board_case(strict-fails-on-warning 1 ARGS ${CMAKE_CURRENT_SOURCE_DIR}/data/board_warn.json --strict DEFS "-DSTDOUT_MATCH=Result: PASS with 1 warning")
coilfit_board_case(unknown-channel 2 ARGS ${board_ex} --channel K9
  DEFS "-DSTDERR_EXACT=coilfit: error: --channel: no channel or pin named \"K9\" on ${board_ex} (its channels: K1 pump, K2-K8 zones)")
# --output: the report is written whole (the helper `size` uses).
add_test(NAME cli.board.output
  COMMAND ${CMAKE_COMMAND} "-DCMD=${COILFIT_EXE}|board|${board_ex_max_on}|--format|json|--output|${CMAKE_CURRENT_BINARY_DIR}/board-output.json"
          -DRC=0 "-DSTDOUT_NOT_MATCH=." -P ${run_case})
set_tests_properties(cli.board.output PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")
# --output naming the board file itself (a scratch copy): refused before anything is written.
set(board_scratch ${CMAKE_CURRENT_BINARY_DIR}/board-scratch.json)
configure_file(${board_ex_max_on} ${board_scratch} COPYONLY)
coilfit_board_case(output-is-input 2 ARGS ${board_scratch} --output ${board_scratch}
  DEFS "-DSTDERR_MATCH=^coilfit: error: --output: [^\n]*board-scratch.json is an input of this run")

# Bad board files (tests/data/bad_board, made from one small board of our own): exit 2 and the
# first line of stderr exactly. The cases run in that folder so that messages name them short.
set(bad_board_dir ${CMAKE_CURRENT_SOURCE_DIR}/data/bad_board)
function(coilfit_bad_board name expected_line)
  string(REPLACE ";" "\\;" expected_line "${expected_line}")
  set(defs "-DCMD=${COILFIT_EXE}|board|${name}.json" -DRC=2 "-DSTDERR_EXACT=${expected_line}" "-DWORKDIR=${bad_board_dir}"
           "-DSTDOUT_NOT_MATCH=Result")
  add_test(NAME cli.board.bad.${name} COMMAND ${CMAKE_COMMAND} ${defs} -P ${run_case})
  set_tests_properties(cli.board.bad.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1")
endfunction()

coilfit_bad_board(unknown-key
  "coilfit: error: unknown-key.json: chanels: unknown key (expected one of: ambient, channels, defaults, mcu, name, schema, simultaneous, supply)")
coilfit_bad_board(spec-schema
  "coilfit: error: spec-schema.json: schema: expected \"coilfit.board/1\" (the schema this coilfit reads), got \"coilfit.spec/1\"; a spec file is sized with `coilfit size`")
coilfit_bad_board(missing-pin
  "coilfit: error: missing-pin.json: channels[1].pin: missing; expected the MCU pin's name, such as \"PA0\" (every channel has a pin of its own)")
coilfit_bad_board(duplicate-pin
  "coilfit: error: duplicate-pin.json: channels[1].pin: \"PA2\" is already the pin of K1 fan (channels[0])")
coilfit_bad_board(pin-no-number
  "coilfit: error: pin-no-number.json: channels[0].pin: \"FAN\" has no number to count 2 pins on from; give a list of 2 pin names")
coilfit_bad_board(unknown-port
  "coilfit: error: unknown-port.json: channels[1].port: expected one of the mcu's ports (PA), got \"PC\"")
coilfit_bad_board(missing-port
  "coilfit: error: missing-port.json: channels[1].port: missing; expected one of the mcu's ports (PA)")
coilfit_bad_board(duplicate-port
  "coilfit: error: duplicate-port.json: mcu.ports[1].name: port \"PA\" is listed twice (also at mcu.ports[0])")
coilfit_bad_board(mcu-pin-unknown
  "coilfit: error: mcu-pin-unknown.json: mcu.pin.max_curent: unknown key (expected one of: max_current, preset, vdd, vdd_tolerance, voh, voh_current, voh_vdd)")
coilfit_bad_board(unknown-channel-key
  "coilfit: error: unknown-channel-key.json: channels[0].coil.resistanse: unknown key (expected one of: inductance, max_release_time, max_temperature, max_voltage, must_operate, must_operate_temp, must_release, preset, rated_voltage, reference_temp, resistance, self_heating, thermal_resistance, tolerance)")
coilfit_bad_board(channel-negative
  "coilfit: error: channel-negative.json: channels[1].coil.resistance: expected a resistance greater than zero, got -3 Ω")
coilfit_bad_board(bad-default
  "coilfit: error: bad-default.json: defaults.clamp.diode: no diode \"1N9999\" in the parts table (9 files); nearest: 1N4937, 1N5819; `coilfit parts diodes` lists them")
coilfit_bad_board(package-discrete
  "coilfit: error: package-discrete.json: channels[0].package: only a transistor-array channel has a package; this channel's transistor is npn 2N4401")
coilfit_bad_board(package-overfull
  "coilfit: error: package-overfull.json: channels[1].package: U2 would carry 8 channels, but array-7ch-darlington-50v has 7; name another package for the rest")
coilfit_bad_board(max-on-zero
  "coilfit: error: max-on-zero.json: simultaneous.max_on: expected a whole number of channels from 1 to 1024, got 0")
coilfit_bad_board(group-unknown
  "coilfit: error: group-unknown.json: simultaneous.groups[1][0]: no channel or pin named \"K9\" on this board")
coilfit_bad_board(group-twice
  "coilfit: error: group-twice.json: simultaneous.groups[1][0]: K2-K4 vents #2 is already in simultaneous.groups[0]; a channel belongs to one group at most")
coilfit_bad_board(no-channels
  "coilfit: error: no-channels.json: channels: expected a list of one or more channels such as [ { \"name\": \"K1 pump\", \"pin\": \"PA0\", ... } ], got an empty list")
