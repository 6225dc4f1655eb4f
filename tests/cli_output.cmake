# How coilfit writes its files (src/io/output.hpp), end to end: tests/output_cases.sh runs
# each case in its own scratch folder of the build tree, with its own files, links and FIFOs.
find_program(COILFIT_SH sh REQUIRED)
set(output_cases_script ${CMAKE_CURRENT_SOURCE_DIR}/output_cases.sh)
set(output_scratch ${CMAKE_CURRENT_BINARY_DIR}/output-cases)
foreach(case IN ITEMS
    dash-is-stdout fifo-written-not-replaced dev-stdout-on-a-pipe mode-kept new-file-follows-umask
    link-written-through dangling-link-creates-target link-loop long-name folder-is-an-error
    output-is-the-spec output-is-a-parts-file two-outputs-one-file repeated-flags-last-wins
    top-whole-number empty-names parts-folder-entries parts-folder-size-limit hostile-file-names
    inline-labels)
  add_test(NAME cli.output.${case}
           COMMAND ${COILFIT_SH} ${output_cases_script} ${case} ${COILFIT_EXE} ${output_scratch}
                   ${COILFIT_EXAMPLES_DIR} ${COILFIT_PARTS_DIR})
  set_tests_properties(cli.output.${case} PROPERTIES TIMEOUT 60)
endforeach()
