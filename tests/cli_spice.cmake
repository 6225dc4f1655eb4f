# coilfit size --netlist: the SPICE netlist of the sized circuit, run through ngspice.
set(netlist_case ${CMAKE_CURRENT_SOURCE_DIR}/netlist_case.cmake)
set(run_case ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set(netlist_dir ${CMAKE_CURRENT_BINARY_DIR}/netlists)
file(MAKE_DIRECTORY ${netlist_dir})

foreach(example greenhouse-valve)
  add_test(NAME cli.netlist.ngspice.${example}
           COMMAND ${CMAKE_COMMAND} -DCOILFIT=${COILFIT_EXE} -DSPEC=${COILFIT_EXAMPLES_DIR}/${example}.json
                   -DOUT=${netlist_dir}/${example}.cir -P ${netlist_case})
  set_tests_properties(cli.netlist.ngspice.${example} PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")
endforeach()

# One channel of a transistor array: its input resistor and a Darlington pair, the built-in diode.
add_test(NAME cli.netlist.ngspice.array-channel
         COMMAND ${CMAKE_COMMAND} -DCOILFIT=${COILFIT_EXE} -DSPEC=${CMAKE_CURRENT_SOURCE_DIR}/data/array_valve.json
                 -DOUT=${netlist_dir}/array-channel.cir -P ${netlist_case})
set_tests_properties(cli.netlist.ngspice.array-channel PROPERTIES ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")

# Without the coil inductance there is nothing to simulate: bad usage (exit 2), nothing written.
add_test(NAME cli.netlist.needs-inductance
         COMMAND ${CMAKE_COMMAND}
                 "-DCMD=${COILFIT_EXE};size;--supply;12V;--coil-voltage;12V;--coil-resistance;400R;--pin-vdd;3.3V;--pin-max-current;8mA;--transistor;2N4401;--diode;1N4148;--netlist;${netlist_dir}/no-inductance.cir"
                 -DRC=2 "-DSTDERR_MATCH=--netlist: the simulation needs the coil inductance; give coil.inductance"
                 "-DSTDOUT_NOT_MATCH=Result" -P ${run_case})
# An unwritable place is an error naming the file.
add_test(NAME cli.netlist.unwritable
         COMMAND ${CMAKE_COMMAND}
                 "-DCMD=${COILFIT_EXE};size;${COILFIT_EXAMPLES_DIR}/greenhouse-valve.json;--netlist;${netlist_dir}/no-such-dir/x.cir"
                 -DRC=2 "-DSTDERR_MATCH=no-such-dir/x.cir: cannot write here" -P ${run_case})
set_tests_properties(cli.netlist.needs-inductance cli.netlist.unwritable PROPERTIES
                     ENVIRONMENT "COILFIT_PARTS=${COILFIT_PARTS_DIR}")
