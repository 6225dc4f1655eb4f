# The installed layout (architecture.md "Installed layout"), end to end: install into a folder of
# the build tree, build and run a consumer project against it, move the prefix and run the
# installed program there, and lint the man page and the completion scripts.
set(stage ${CMAKE_BINARY_DIR}/install-test/prefix)
set(moved ${CMAKE_BINARY_DIR}/install-test/moved)

add_test(NAME install.stage
         COMMAND ${CMAKE_COMMAND} -E rm -rf ${stage} ${moved} ${CMAKE_BINARY_DIR}/install-test/consumer)
add_test(NAME install.run COMMAND ${CMAKE_COMMAND} --install ${CMAKE_BINARY_DIR} --prefix ${stage})
set_tests_properties(install.stage PROPERTIES FIXTURES_SETUP install_clean)
set_tests_properties(install.run PROPERTIES FIXTURES_REQUIRED install_clean FIXTURES_SETUP installed)

# Every file of the layout is there.
add_test(NAME install.layout COMMAND ${CMAKE_COMMAND} -DPREFIX=${stage} -P ${CMAKE_CURRENT_SOURCE_DIR}/install_layout.cmake)

# A consumer project: find_package(coilfit), link coilfit::core, size one spec in code.
set(consumer_options -DCMAKE_PREFIX_PATH=${stage} -DCMAKE_BUILD_TYPE=${CMAKE_BUILD_TYPE}
    -DCMAKE_CXX_COMPILER=${CMAKE_CXX_COMPILER} "-DCMAKE_CXX_FLAGS=${CMAKE_CXX_FLAGS}")
if(CMAKE_CXX_COMPILER_LAUNCHER)
  list(APPEND consumer_options -DCMAKE_CXX_COMPILER_LAUNCHER=${CMAKE_CXX_COMPILER_LAUNCHER})
endif()
add_test(NAME install.consumer
         COMMAND ${CMAKE_CTEST_COMMAND} --build-and-test ${CMAKE_CURRENT_SOURCE_DIR}/consumer
                 ${CMAKE_BINARY_DIR}/install-test/consumer
                 --build-generator ${CMAKE_GENERATOR} --build-noclean
                 --build-options ${consumer_options}
                 --test-command coilfit_consumer)
set_tests_properties(install.consumer PROPERTIES PASS_REGULAR_EXPRESSION "figures hold")

# The prefix moved elsewhere: the program finds the table beside itself, not the source tree's.
add_test(NAME install.relocated.copy COMMAND ${CMAKE_COMMAND} -E copy_directory ${stage} ${moved})
set_tests_properties(install.relocated.copy PROPERTIES FIXTURES_REQUIRED installed FIXTURES_SETUP moved)
add_test(NAME install.relocated.parts
         COMMAND ${CMAKE_COMMAND} "-DCMD=${moved}/bin/coilfit|parts|coil" -DRC=0
                 "-DSTDOUT_MATCH=Read from: ${moved}/share/coilfit/parts/"
                 -P ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
add_test(NAME install.relocated.size
         COMMAND ${CMAKE_COMMAND} "-DCMD=${moved}/bin/coilfit|size|${COILFIT_EXAMPLES_DIR}/greenhouse-valve.json" -DRC=0
                 "-DSTDOUT_MATCH=Result: PASS" -P ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set_tests_properties(install.relocated.parts install.relocated.size PROPERTIES
                     FIXTURES_REQUIRED moved ENVIRONMENT_MODIFICATION "COILFIT_PARTS=unset:")
set_tests_properties(install.layout install.consumer PROPERTIES FIXTURES_REQUIRED installed)

# The man page renders without a warning.
add_test(NAME man.lint COMMAND ${CMAKE_COMMAND} -DPAGE=${PROJECT_BINARY_DIR}/coilfit.1
         -P ${CMAKE_CURRENT_SOURCE_DIR}/man_lint.cmake)

# Bash completion: source the script, fill COMP_WORDS, call its function, read COMPREPLY.
find_program(BASH_PROGRAM bash)
if(BASH_PROGRAM)
  add_test(NAME completion.bash
           COMMAND ${BASH_PROGRAM} ${CMAKE_CURRENT_SOURCE_DIR}/completion_test.bash
                   ${PROJECT_SOURCE_DIR}/src/shell/coilfit.bash $<TARGET_FILE:coilfit> ${PROJECT_SOURCE_DIR}/parts)
  set_tests_properties(completion.bash PROPERTIES ENVIRONMENT_MODIFICATION "COILFIT_PARTS=unset:")
endif()
find_program(ZSH_PROGRAM zsh)
if(ZSH_PROGRAM)
  add_test(NAME completion.zsh-syntax COMMAND ${ZSH_PROGRAM} -n ${PROJECT_SOURCE_DIR}/src/shell/_coilfit)
endif()
