# coilfit size --plot FILE.svg: the turn-off transient of every clamp option. tests/plot/
# check_plot.py reads the SVG as XML (well-formed), checks that it draws every clamp option of
# the report and that the report's own figures (highest coil current, release current and
# release time, peak collector voltage, derated limit) read back off the drawing; the render
# cases also screenshot it in headless chromium and check the picture (skipped without it).
find_program(COILFIT_PLOT_PYTHON3 NAMES python3 PATHS /usr/bin NO_DEFAULT_PATH)
if(NOT COILFIT_PLOT_PYTHON3)
  find_program(COILFIT_PLOT_PYTHON3 NAMES python3)
endif()
set(plot_dir ${CMAKE_CURRENT_BINARY_DIR}/plots)
set(check_plot ${CMAKE_CURRENT_SOURCE_DIR}/plot/check_plot.py)
set(run_case ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
file(MAKE_DIRECTORY ${plot_dir})
set(plot_tests)

if(COILFIT_PLOT_PYTHON3)
  file(GLOB plot_examples CONFIGURE_DEPENDS ${COILFIT_EXAMPLES_DIR}/*.json)
  foreach(f IN LISTS plot_examples)
    get_filename_component(name ${f} NAME_WE)
    file(READ ${f} text)
    string(JSON kind ERROR_VARIABLE json_error GET "${text}" schema)
    if(NOT kind STREQUAL "coilfit.spec/1")
      continue()
    endif()
    add_test(NAME plot.svg.${name} COMMAND ${COILFIT_PLOT_PYTHON3} ${check_plot} ${COILFIT_EXE} ${f} ${plot_dir}/svg)
    list(APPEND plot_tests plot.svg.${name})
  endforeach()
  # In a browser: a diode clamp beside the zeners that fit, and a zener clamp (dust extractor).
  foreach(name greenhouse-valve dust-extractor)
    add_test(NAME plot.render.${name}
             COMMAND ${COILFIT_PLOT_PYTHON3} ${check_plot} ${COILFIT_EXE} ${COILFIT_EXAMPLES_DIR}/${name}.json ${plot_dir}/render-${name} --render)
    list(APPEND plot_tests plot.render.${name})
  endforeach()
  set_tests_properties(${plot_tests} PROPERTIES SKIP_RETURN_CODE 77 ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")
  set_tests_properties(plot.render.greenhouse-valve plot.render.dust-extractor PROPERTIES TIMEOUT 180)
else()
  add_test(NAME plot.python3-missing COMMAND ${CMAKE_COMMAND} -E echo "SKIP: no python3; the plot checks need it")
  set_tests_properties(plot.python3-missing PROPERTIES SKIP_REGULAR_EXPRESSION "SKIP:")
endif()

# Without the coil inductance there is no transient: bad usage (exit 2), nothing written.
add_test(NAME plot.needs-inductance
         COMMAND ${CMAKE_COMMAND}
                 "-DCMD=${COILFIT_EXE};size;--supply;12V;--coil-voltage;12V;--coil-resistance;400R;--pin-vdd;3.3V;--pin-max-current;8mA;--transistor;2N4401;--diode;1N4148;--plot;${plot_dir}/no-inductance.svg"
                 -DRC=2 "-DSTDERR_MATCH=--plot: the turn-off transient needs the coil inductance; give coil.inductance"
                 "-DSTDOUT_NOT_MATCH=Result" -P ${run_case})
# An unwritable place is an error naming the file.
add_test(NAME plot.unwritable
         COMMAND ${CMAKE_COMMAND}
                 "-DCMD=${COILFIT_EXE};size;${COILFIT_EXAMPLES_DIR}/greenhouse-valve.json;--plot;${plot_dir}/no-such-dir/x.svg"
                 -DRC=2 "-DSTDERR_MATCH=no-such-dir/x.svg: cannot write here" -P ${run_case})
set_tests_properties(plot.needs-inductance plot.unwritable PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")
