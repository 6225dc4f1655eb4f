# End-to-end tests of `coilfit yield`: exit codes, JSON shape, determinism and --jobs.
set(yield_rc_script ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set(yield_same_script ${CMAKE_CURRENT_SOURCE_DIR}/yield_same_output.cmake)
set(yield_data ${CMAKE_CURRENT_SOURCE_DIR}/data)

function(coilfit_yield_case name rc)
  cmake_parse_arguments(A "" "STDOUT_MATCH;STDERR_MATCH;STDERR_EXACT;STDOUT_NOT_MATCH" "ARGS" ${ARGN})
  string(REPLACE ";" "|" joined "${COILFIT_EXE};yield;${A_ARGS}")
  set(defs "-DCMD=${joined}" -DRC=${rc})
  foreach(k STDOUT_MATCH STDERR_MATCH STDERR_EXACT STDOUT_NOT_MATCH)
    if(DEFINED A_${k})
      string(REPLACE ";" "\\;" value "${A_${k}}")
      list(APPEND defs "-D${k}=${value}")
    endif()
  endforeach()
  add_test(NAME cli.yield.${name} COMMAND ${CMAKE_COMMAND} ${defs} -P ${yield_rc_script})
  set_tests_properties(cli.yield.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1")
endfunction()

# Two runs that must print the same thing.
function(coilfit_yield_same name rc)
  cmake_parse_arguments(A "" "" "A;B" ${ARGN})
  string(REPLACE ";" "|" a "${COILFIT_EXE};yield;${A_A}")
  string(REPLACE ";" "|" b "${COILFIT_EXE};yield;${A_B}")
  add_test(NAME cli.yield.${name} COMMAND ${CMAKE_COMMAND} "-DCMD_A=${a}" "-DCMD_B=${b}" -DRC=${rc} -P ${yield_same_script})
  set_tests_properties(cli.yield.${name} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR};NO_COLOR=1")
endfunction()

set(greenhouse ${COILFIT_EXAMPLES_DIR}/greenhouse-valve.json)
set(marginal ${yield_data}/yield_marginal_operate.json)

# The worst case passes: every sample passes, exit 0, the JSON keys of the contract.
coilfit_yield_case(pass-json 0 ARGS ${greenhouse} --samples 20000 --format json
  STDOUT_MATCH "\"samples\": 20000,.*\"seed\": 1,.*\"pass_rate\": 1\\.0,.*\"interval\": \\[.*\"checks\": \\[.*\"id\": \"coil.operate\",.*\"pass_rate\": 1\\.0")
coilfit_yield_case(pass-text 0 ARGS ${greenhouse} --samples 5000
  STDOUT_MATCH "pass rate +100 %.*Wilson")
# Some samples fail: exit 1, the most frequent failure named.
coilfit_yield_case(fail-json 1 ARGS ${marginal} --samples 20000 --seed 7 --format json
  STDOUT_MATCH "\"seed\": 7,.*\"most_frequent_failure\": \"coil.operate\"")
coilfit_yield_case(fail-text 1 ARGS ${marginal} --samples 20000 --distribution normal
  STDOUT_MATCH "normal within the tolerances.*coil.operate")
# A spec given wholly as flags.
coilfit_yield_case(one-shot 0 ARGS --supply 12V --coil-resistance 400R --coil-voltage 12V --pin-vdd 3.3V
  --pin-max-current 8mA --transistor 2N4401 --diode 1N4148 --ambient-max 50C --samples 1000 --format json
  STDOUT_MATCH "\"pass_rate\": 1\\.0")
# Bad input exits 2.
coilfit_yield_case(zero-samples 2 ARGS ${greenhouse} --samples 0 STDERR_MATCH "--samples")
coilfit_yield_case(bad-distribution 2 ARGS ${greenhouse} --distribution triangle STDERR_MATCH "--distribution")
coilfit_yield_case(bad-seed 2 ARGS ${greenhouse} --seed -1 STDERR_MATCH "--seed")
coilfit_yield_case(no-spec 2 ARGS --samples 10 STDERR_MATCH "no spec")

# Deterministic: the same seed gives the same output; --jobs 1 and --jobs 2 agree exactly,
# in JSON and in text; nothing on stderr when it is not a terminal.
coilfit_yield_same(jobs-json 1
  A ${marginal} --samples 300000 --seed 11 --jobs 1 --format json
  B ${marginal} --samples 300000 --seed 11 --jobs 2 --format json)
coilfit_yield_same(jobs-text-normal 1
  A ${marginal} --samples 200000 --seed 3 --jobs 1 --distribution normal
  B ${marginal} --samples 200000 --seed 3 --jobs 2 --distribution normal)
coilfit_yield_same(repeat 0
  A ${greenhouse} --samples 50000 --seed 5 --format json
  B ${greenhouse} --samples 50000 --seed 5 --format json)
