# Golden text report: runs coilfit at a fixed width and compares its output exactly with a file
# in tests/golden/ (the version in the first line is written as <version>).
#   cmake -DEXE=coilfit -DSPEC=file -DCOLUMNS=80 -DGOLDEN=tests/golden/x.txt -DPARTS=dir [-DARGS=a|b]
#         [-DUPDATE_GOLDEN=ON] -P golden_check.cmake
# To change the layout deliberately, rewrite the files and review the difference:
#   COILFIT_UPDATE_GOLDEN=1 ctest --test-dir build/dev -R golden && git diff tests/golden
string(REPLACE "|" ";" ARGS "${ARGS}")
execute_process(
  COMMAND ${CMAKE_COMMAND} -E env COLUMNS=${COLUMNS} NO_COLOR=1 COILFIT_PARTS=${PARTS} ${EXE} size ${SPEC} ${ARGS}
  WORKING_DIRECTORY ${WORKDIR}
  RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
if(NOT rc EQUAL 0 AND NOT rc EQUAL 1)
  message(FATAL_ERROR "coilfit exited ${rc}:\n${err}")
endif()
string(REGEX REPLACE "^coilfit [0-9][0-9.]* - " "coilfit <version> - " out "${out}")
if(UPDATE_GOLDEN OR "$ENV{COILFIT_UPDATE_GOLDEN}")
  file(WRITE ${GOLDEN} "${out}")
  message(STATUS "rewrote ${GOLDEN}")
  return()
endif()
if(NOT EXISTS ${GOLDEN})
  message(FATAL_ERROR "${GOLDEN} does not exist; write it with COILFIT_UPDATE_GOLDEN=1")
endif()
file(READ ${GOLDEN} expected)
if(NOT out STREQUAL expected)
  file(WRITE ${GOLDEN}.actual "${out}")
  message(FATAL_ERROR "the report differs from ${GOLDEN}; the output is in ${GOLDEN}.actual:\n"
                      "  diff -u ${GOLDEN} ${GOLDEN}.actual\n"
                      "If the change is meant, rewrite the golden files (COILFIT_UPDATE_GOLDEN=1 ctest -R golden).")
endif()
# Every line fits the width (display columns: each UTF-8 lead byte is one column here; the
# report's symbols are narrow).
string(REPLACE "\n" ";" lines "${out}")
foreach(line IN LISTS lines)
  string(REGEX REPLACE "[\x80-\xbf]" "" narrow "${line}")
  string(LENGTH "${narrow}" n)
  if(n GREATER COLUMNS)
    message(FATAL_ERROR "a line is ${n} columns wide, over ${COLUMNS}:\n${line}")
  endif()
endforeach()
