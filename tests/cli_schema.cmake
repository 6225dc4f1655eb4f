# The JSON contracts (architecture "JSON contracts"): every shipped schema is a valid draft 2020-12
# schema, every example validates against its input schema, and every JSON output of every
# example validates against its output schema. Runs tests/schema/validate.py with the system
# python3 and python3-jsonschema (Debian package); skipped with a message without them.
find_program(COILFIT_PYTHON3 NAMES python3 PATHS /usr/bin NO_DEFAULT_PATH)
if(NOT COILFIT_PYTHON3)
  find_program(COILFIT_PYTHON3 NAMES python3)
endif()
set(schema_dir ${PROJECT_SOURCE_DIR}/src/schemas)
set(validate ${CMAKE_CURRENT_SOURCE_DIR}/schema/validate.py)
set(schema_tests)

if(NOT COILFIT_PYTHON3)
  add_test(NAME schema.python3-missing COMMAND ${CMAKE_COMMAND} -E echo "SKIP: no python3; the schema tests need python3 and python3-jsonschema")
  set_tests_properties(schema.python3-missing PROPERTIES SKIP_REGULAR_EXPRESSION "SKIP:")
  return()
endif()

macro(schema_test name)
  add_test(NAME ${name} COMMAND ${COILFIT_PYTHON3} ${validate} ${schema_dir} ${ARGN})
  list(APPEND schema_tests ${name})
endmacro()

schema_test(schema.metaschema check)
schema_test(schema.board.architecture-example file coilfit.board-1.schema.json ${CMAKE_CURRENT_SOURCE_DIR}/schema/board-greenhouse.json)

# Each example by its own "schema": specs and board files.
file(GLOB schema_examples CONFIGURE_DEPENDS ${COILFIT_EXAMPLES_DIR}/*.json)
foreach(f IN LISTS schema_examples)
  get_filename_component(name ${f} NAME_WE)
  file(READ ${f} text)
  string(JSON kind ERROR_VARIABLE json_error GET "${text}" schema)
  if(kind STREQUAL "coilfit.spec/1")
    schema_test(schema.spec.${name} file coilfit.spec-1.schema.json ${f})
    # Exit 0 or 1 (a check may fail in an example); either way the JSON must hold to its schema.
    schema_test(schema.report.${name} run coilfit.report-1.schema.json 0,1 -- ${COILFIT_EXE} size ${f} --format json)
    schema_test(schema.pick.${name} run coilfit.pick-1.schema.json 0,1 -- ${COILFIT_EXE} pick ${f} --format json)
    schema_test(schema.yield.${name} run coilfit.yield-1.schema.json 0,1 -- ${COILFIT_EXE} yield ${f} --format json --samples 2000)
  elseif(kind STREQUAL "coilfit.board/1")
    schema_test(schema.board.${name} file coilfit.board-1.schema.json ${f})
    schema_test(schema.board-report.${name} run coilfit.board-report-1.schema.json 0,1 -- ${COILFIT_EXE} board ${f} --format json)
  else()
    add_test(NAME schema.example.${name} COMMAND ${CMAKE_COMMAND} -E false)
    message(WARNING "${f}: no \"schema\" of coilfit.spec/1 or coilfit.board/1 (${json_error}); its schema test fails")
  endif()
endforeach()

schema_test(schema.parts.all run coilfit.parts-1.schema.json 0 -- ${COILFIT_EXE} parts --format json)
schema_test(schema.parts.one run coilfit.parts-1.schema.json 0 -- ${COILFIT_EXE} parts 2N4401 --format json)

# The schemas are not vacuous: outputs broken in ways the contract forbids (a missing stamp, a
# verdict outside pass|warn|fail|skip, a bad check id, a quantity that is not a number) fail.
set(reject_spec ${COILFIT_EXAMPLES_DIR}/garage-door.json)
schema_test(schema.rejects.report reject coilfit.report-1.schema.json 0,1 -- ${COILFIT_EXE} size ${reject_spec} --format json)
schema_test(schema.rejects.pick reject coilfit.pick-1.schema.json 0,1 -- ${COILFIT_EXE} pick ${reject_spec} --format json)
schema_test(schema.rejects.yield reject coilfit.yield-1.schema.json 0,1 -- ${COILFIT_EXE} yield ${reject_spec} --format json --samples 500)
schema_test(schema.rejects.parts reject coilfit.parts-1.schema.json 0 -- ${COILFIT_EXE} parts --format json)

set_tests_properties(${schema_tests} PROPERTIES SKIP_RETURN_CODE 77 ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")
