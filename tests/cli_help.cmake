# Help screens and usage errors end to end: our own layout (usage line naming `coilfit`, grouped
# options with their defaults, fitted to COLUMNS), and a usage error as one line with a hint.
set(help_rc_script ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set(help_ex ${COILFIT_EXAMPLES_DIR}/greenhouse-valve.json)

function(coilfit_help_case name rc)
  cmake_parse_arguments(A "" "STDOUT_MATCH;STDOUT_NOT_MATCH;STDOUT_FIRST;STDERR_EXACT;LINE_MAX;COLUMNS" "ARGS" ${ARGN})
  string(REPLACE ";" "|" joined "${COILFIT_EXE};${A_ARGS}")
  set(defs "-DCMD=${joined}" -DRC=${rc})
  foreach(k STDOUT_MATCH STDOUT_NOT_MATCH STDOUT_FIRST STDERR_EXACT LINE_MAX)
    if(DEFINED A_${k})
      string(REPLACE ";" "\\;" value "${A_${k}}")
      list(APPEND defs "-D${k}=${value}")
    endif()
  endforeach()
  if(NOT DEFINED A_COLUMNS)
    set(A_COLUMNS 100)
  endif()
  add_test(NAME cli.help.${name} COMMAND ${CMAKE_COMMAND} ${defs} -P ${help_rc_script})
  set_tests_properties(cli.help.${name} PROPERTIES
                       ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1;COLUMNS=${A_COLUMNS}")
endfunction()

# The argument library's stock words, which our screens never show.
set(stock "Positionals:|TEXT|UINT|\\{text,json\\}|REQUIRED|Subcommands:")

coilfit_help_case(program 0 ARGS --help STDOUT_FIRST "Usage: coilfit COMMAND [options]"
  STDOUT_MATCH "Commands\n  size +size and check one driver channel at worst case\n" STDOUT_NOT_MATCH "${stock}")
coilfit_help_case(size 0 ARGS size --help STDOUT_FIRST "Usage: coilfit size [SPEC] [options]"
  STDOUT_NOT_MATCH "${stock}|/coilfit ")
# Options grouped: the command's own first, then General, then the spec fields by section, each
# option with its default.
coilfit_help_case(size-groups 0 ARGS size --help
  STDOUT_MATCH "\nSize\n  --strict .*\n\nGeneral\n  --parts PATH .*\n\nSpec: supply and ambient\n.*\n\nSpec: coil\n.*\n\nSpec: microcontroller pin\n.*\n\nSpec: driver\n.*\n\nSpec: clamp\n.*\n\nSpec: method policy\n.*\n\nSpec: switching, relay and load\n")
coilfit_help_case(size-defaults 0 ARGS size --help
  STDOUT_MATCH "--format text\\|json +output format \\(default text\\).*--supply-tolerance PERCENT +supply tolerance, e.g. 10% \\(default 10%\\)")
coilfit_help_case(pick-own-first 0 ARGS pick --help STDOUT_FIRST "Usage: coilfit pick [SPEC] [options]"
  STDOUT_MATCH "\n\nArguments\n  SPEC .*\n\nPick\n  --top N +list only the best N rows, a whole number \\(default 0: all\\)\n  --all-clamps .*\n\nGeneral\n.*\n\nSpec: supply")
coilfit_help_case(yield-own-first 0 ARGS yield --help STDOUT_FIRST "Usage: coilfit yield [SPEC] [options]"
  STDOUT_MATCH "\n\nYield\n  --samples N +number of samples \\(default 100000\\)\n.*--jobs J.*\n\nGeneral\n.*\n\nSpec: supply")
coilfit_help_case(parts 0 ARGS parts --help STDOUT_FIRST "Usage: coilfit parts [KIND] [ID] [options]"
  STDOUT_NOT_MATCH "${stock}|--output")
# Fitted to the terminal: no line wider than COLUMNS.
coilfit_help_case(width-60 0 ARGS size --help COLUMNS 60 LINE_MAX 60)
coilfit_help_case(width-80 0 ARGS yield --help COLUMNS 80 LINE_MAX 80)
coilfit_help_case(width-200 0 ARGS pick --help COLUMNS 200 LINE_MAX 200)

# Usage errors: one line, "coilfit: error: ...", with a hint. (The expected line is a parameter of
# its own so that its semicolons survive.)
function(coilfit_usage_error name expected_line)
  string(REPLACE ";" "|" joined "${COILFIT_EXE};${ARGN}")
  add_test(NAME cli.usage.${name}
           COMMAND ${CMAKE_COMMAND} "-DCMD=${joined}" -DRC=2 "-DSTDERR_EXACT=${expected_line}" -P ${help_rc_script})
  set_tests_properties(cli.usage.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1")
endfunction()

coilfit_usage_error(mistyped-command
  "coilfit: error: unknown command \"sise\"; did you mean size? (see coilfit --help)"
  sise ${help_ex})
coilfit_usage_error(short-command
  "coilfit: error: unknown command \"yie\"; did you mean yield? (see coilfit --help)"
  yie)
coilfit_usage_error(unknown-command
  "coilfit: error: unknown command \"frobnicate\"; expected size, pick, yield, board or parts (see coilfit --help)"
  frobnicate)
coilfit_usage_error(mistyped-flag
  "coilfit: error: unknown option --suply; did you mean --supply? (see coilfit size --help)"
  size ${help_ex} --suply 12V)
coilfit_usage_error(cut-short-flag
  "coilfit: error: unknown option --sampl; did you mean --samples? (see coilfit yield --help)"
  yield ${help_ex} --sampl=10)
coilfit_usage_error(bad-choice
  "coilfit: error: --format: expected text or json, got \"xml\" (see coilfit size --help)"
  size ${help_ex} --format xml)
coilfit_usage_error(missing-value
  "coilfit: error: --top: expected a value (see coilfit pick --help)"
  pick ${help_ex} --top)
coilfit_usage_error(extra-argument
  "coilfit: error: unexpected argument \"second.json\" (see coilfit size --help)"
  size ${help_ex} second.json)
coilfit_usage_error(option-before-command
  "coilfit: error: unknown option --format; a command comes first: size, pick, yield, board or parts (see coilfit --help)"
  --format json)
coilfit_usage_error(no-command
  "coilfit: error: no command given; expected size, pick, yield, board or parts (see coilfit --help)"
  "")
