# Runs two commands and checks that they exit alike and print the same standard output, and that
# neither writes to standard error (no progress line when stderr is not a terminal).
#   cmake -DCMD_A="prog|arg|..." -DCMD_B="prog|arg|..." -DRC=0 -P yield_same_output.cmake
string(REPLACE "|" ";" CMD_A "${CMD_A}")
string(REPLACE "|" ";" CMD_B "${CMD_B}")
execute_process(COMMAND ${CMD_A} RESULT_VARIABLE rc_a OUTPUT_VARIABLE out_a ERROR_VARIABLE err_a)
execute_process(COMMAND ${CMD_B} RESULT_VARIABLE rc_b OUTPUT_VARIABLE out_b ERROR_VARIABLE err_b)
if(NOT "${rc_a}" STREQUAL "${RC}" OR NOT "${rc_b}" STREQUAL "${RC}")
  message(FATAL_ERROR "exit codes ${rc_a} and ${rc_b}, expected ${RC}\n--- stderr A:\n${err_a}\n--- stderr B:\n${err_b}")
endif()
if(NOT out_a STREQUAL out_b)
  message(FATAL_ERROR "outputs differ\n--- A:\n${out_a}\n--- B:\n${out_b}")
endif()
if(out_a STREQUAL "")
  message(FATAL_ERROR "no output")
endif()
if(NOT err_a STREQUAL "" OR NOT err_b STREQUAL "")
  message(FATAL_ERROR "standard error not empty:\n--- A:\n${err_a}\n--- B:\n${err_b}")
endif()
