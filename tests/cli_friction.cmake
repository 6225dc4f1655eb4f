# End-to-end cases for what a newcomer types: plausible ranges, id matching, `parts` kinds and
# records, unsetting from flags, the text report's layout and width, pick's rows.
set(friction_script ${CMAKE_CURRENT_SOURCE_DIR}/run_case.cmake)
set(friction_ex ${COILFIT_EXAMPLES_DIR})

# friction_case(name rc "exact first stderr line or empty" ARGS ... [STDOUT_MATCH re] [STDOUT_NOT_MATCH re] [ENV k=v])
function(friction_case name rc first_line)
  cmake_parse_arguments(A "" "STDOUT_MATCH;STDOUT_NOT_MATCH;COLUMNS" "ARGS" ${ARGN})
  string(REPLACE ";" "|" joined "${COILFIT_EXE};${A_ARGS}")
  set(defs "-DCMD=${joined}" -DRC=${rc} "-DWORKDIR=${COILFIT_EXAMPLES_DIR}")
  if(NOT first_line STREQUAL "")
    string(REPLACE ";" "\\;" first_line "${first_line}")
    list(APPEND defs "-DSTDERR_EXACT=${first_line}")
  endif()
  foreach(k STDOUT_MATCH STDOUT_NOT_MATCH)
    if(DEFINED A_${k})
      string(REPLACE ";" "\\;" value "${A_${k}}")
      list(APPEND defs "-D${k}=${value}")
    endif()
  endforeach()
  set(env "COILFIT_PARTS=${COILFIT_PARTS_DIR}" "NO_COLOR=1")
  if(DEFINED A_COLUMNS)
    list(APPEND env "COLUMNS=${A_COLUMNS}")
  endif()
  add_test(NAME cli.friction.${name} COMMAND ${CMAKE_COMMAND} ${defs} -P ${friction_script})
  set_tests_properties(cli.friction.${name} PROPERTIES ENVIRONMENT "${env}")
endfunction()

# The cases run in examples/ so that messages name the files short.
set(valve greenhouse-valve.json)

# Plausible ranges (common practice, src/io/plausible.cpp): a plain number keeps meaning SI units.
friction_case(pin-current-plain-amperes 2
  "coilfit: error: --pin-max-current: 8 A is not a plausible pin current (1 µA to 200 mA); did you mean 8mA?"
  ARGS size ${valve} --pin-max-current 8)
friction_case(pin-current-plain-fraction 0 "" ARGS size ${valve} --pin-max-current 0.008 STDOUT_MATCH "PASS")
friction_case(pin-vdd-millivolts 2
  "coilfit: error: --pin-vdd: 3.3 kV is not a plausible logic pin voltage (500 mV to 60 V); did you mean 3300mV?"
  ARGS size ${valve} --pin-vdd 3300)
friction_case(coil-resistance-kilohms 2
  "coilfit: error: --coil-resistance: 400 mΩ is not a plausible coil resistance (1 Ω to 200 kΩ); did you mean 0.4k?"
  ARGS size ${valve} --coil-resistance 0.4)
friction_case(coil-current 2
  "coilfit: error: --coil-resistance: 48 V across 2 Ω is 24 A, not a plausible coil current (100 µA to 20 A); did you mean 2k?"
  ARGS size ${valve} --coil-resistance 2 --coil-voltage 48V)
friction_case(base-resistor-kilohms 2
  "coilfit: error: --base-resistor: 1.2 Ω is not a plausible base resistor (10 Ω to 10 MΩ); did you mean 1.2k?"
  ARGS size ${valve} --base-resistor 1.2)
friction_case(supply-millivolts 2
  "coilfit: error: --supply: 12 kV is not a plausible coil supply voltage (100 mV to 1 kV); did you mean 12000mV?"
  ARGS size ${valve} --supply 12000)

# Ids: case-insensitive when unambiguous; an unknown id lists the nearest.
friction_case(id-any-case 0 "" ARGS size ${valve} --transistor 2n4401 --diode 1n4148 STDOUT_MATCH "2N4401")
friction_case(id-nearest 2
  "coilfit: error: --transistor: no transistor \"2N4400\" in the parts table (9 files); nearest: 2N4401, 2N7000, 2N3904; `coilfit parts transistors` lists them"
  ARGS size ${valve} --transistor 2N4400)
friction_case(id-nothing-near 2
  "coilfit: error: --diode: no diode \"XYZ\" in the parts table (9 files); `coilfit parts diodes` lists them"
  ARGS size ${valve} --diode XYZ)
friction_case(parts-unknown 2 "coilfit: error: parts: no part or preset \"2N9999\" in the table; nearest: 2N3904" ARGS parts 2N9999)
friction_case(parts-any-case 0 "" ARGS parts 2n4401 STDOUT_MATCH "^2N4401 \\(npn\\)\n")
friction_case(parts-plural 0 "" ARGS parts transistors STDOUT_MATCH "Transistors \\([0-9]+\\)")
friction_case(parts-mosfets 0 "" ARGS parts mosfets STDOUT_MATCH "N-MOSFETs" STDOUT_NOT_MATCH "Transistors \\(")
friction_case(parts-diodes 0 "" ARGS parts Diodes STDOUT_MATCH "1N4148" STDOUT_NOT_MATCH "Zeners")
friction_case(parts-pins 0 "" ARGS parts pins STDOUT_MATCH "cmos-3v3-8ma")
friction_case(parts-kind-and-id 0 "" ARGS parts zener 1n4744a STDOUT_MATCH "Vz +15 V")
# The readable record gives units: 2N4401's first gain point is 20 at 0.1 mA (the table's 0.0001 A).
friction_case(parts-record-units 0 "" ARGS parts 2N4401 STDOUT_MATCH "hFE min +20 at 100 µA")
friction_case(parts-record-json 0 "" ARGS parts 2N4401 --format json STDOUT_MATCH "\"ic\": 0.0001")

# Unsetting from flags.
friction_case(no-pulldown 0 "" ARGS size ${valve} --no-pulldown STDOUT_MATCH "pull-down +none")
friction_case(no-pulldown-nmos 2
  "coilfit: error: --no-pulldown: \"none\", but an nmos gate needs a pull-down to hold it low while the pin floats (default 100 kΩ); give a resistance such as \"100k\""
  ARGS size greenhouse-vent.json --no-pulldown)
friction_case(clamp-type-replaces-zener 1 "" ARGS size dust-extractor.json --clamp diode_resistor --clamp-resistor 470R
  STDOUT_MATCH "470 Ω resistor")
friction_case(clamp-type-needs-its-field 2
  "coilfit: error: dust-extractor.json: clamp.resistor: missing; a diode_resistor clamp needs a resistance such as \"470R\""
  ARGS size dust-extractor.json --clamp diode_resistor)
friction_case(supply-band-replaces-tolerance 0 "" ARGS size ${valve} --supply-min 11V --supply-max 13.2V STDOUT_MATCH "11 V to 13.2 V")

# pick: one row per driver with its best clamp diode; --all-clamps lists every pair.
friction_case(pick-one-row-per-driver 0 "" ARGS pick ${valve}
  STDOUT_MATCH "18 of 35 transistors .* 1 2N3904 +1N4001 \\(best of 14\\) +470 Ω"
  STDOUT_NOT_MATCH "\n +36 ")
friction_case(pick-all-clamps-top 0 "" ARGS pick ${valve} --all-clamps --top 3 STDOUT_MATCH "of 438 transistor and diode pairs pass.*  3 [^\n]+\n  \\.\\.\\. 435 more")
friction_case(pick-all-clamps-stream 0 "" ARGS pick ${valve} --all-clamps STDOUT_MATCH "every pair, in table order.*[0-9]+ of 438 transistor and diode pairs pass")
friction_case(pick-json-schema 0 "" ARGS pick ${valve} --format json --top 1
  STDOUT_MATCH "^{\n  \"schema\": \"coilfit.pick/1\",\n  \"tool\": {\n    \"name\": \"coilfit\".*\"clamps_tried\": 14")
friction_case(pick-json-all-clamps 0 "" ARGS pick ${valve} --format json --all-clamps STDOUT_MATCH "\"rows\": 438" STDOUT_NOT_MATCH "clamps_tried")

# Golden text reports of one example at 80 and 120 columns, compared exactly (tests/golden/;
# rewrite them deliberately with COILFIT_UPDATE_GOLDEN=1 ctest -R golden, then review git diff).
foreach(cols 80 120)
  add_test(NAME cli.friction.golden-greenhouse-valve-${cols}
    COMMAND ${CMAKE_COMMAND} -DEXE=${COILFIT_EXE} -DSPEC=greenhouse-valve.json -DCOLUMNS=${cols} -DPARTS=${COILFIT_PARTS_DIR}
            -DWORKDIR=${COILFIT_EXAMPLES_DIR} -DGOLDEN=${CMAKE_CURRENT_SOURCE_DIR}/golden/greenhouse-valve-${cols}.txt
            -P ${CMAKE_CURRENT_SOURCE_DIR}/golden_check.cmake)
endforeach()
# A failing design at 80 columns: fix lines, ratios, the window in words.
add_test(NAME cli.friction.golden-garage-door-80
  COMMAND ${CMAKE_COMMAND} -DEXE=${COILFIT_EXE} -DSPEC=garage-door.json -DCOLUMNS=80 -DPARTS=${COILFIT_PARTS_DIR}
          -DWORKDIR=${COILFIT_EXAMPLES_DIR} -DGOLDEN=${CMAKE_CURRENT_SOURCE_DIR}/golden/garage-door-80.txt
          -P ${CMAKE_CURRENT_SOURCE_DIR}/golden_check.cmake)

# An inline record needs no source, and the report labels it inline.
friction_case(inline-record-no-source 0 "" ARGS size ${CMAKE_CURRENT_SOURCE_DIR}/data/inline_no_source.json
  STDOUT_MATCH "transistor +inline bench-npn \\(npn")
friction_case(brief 1 "" ARGS size garage-door.json --brief
  STDOUT_MATCH "^coilfit [0-9.]+ - garage door opener, motor relay\nResult: FAIL: 1 of 10 checks fail; worst: pin.current.\nDesign: BC547B, base resistor 560 Ω E24, pull-down 47 kΩ, clamp diode 1N4148\n  FAIL pin.current: 9.29 mA against 4 mA \\(-132 % \\(2.3x\\)\\)\n$")
friction_case(width-40 0 "" COLUMNS 40 ARGS size ${valve} STDOUT_MATCH "\n  coil.operate  pass\n    coil voltage vs must-operate\n")
# Streamed JSON of every pair is one valid document: the counts follow the candidates.
friction_case(pick-json-stream-valid 0 "" ARGS pick ${valve} --format json --all-clamps
  STDOUT_MATCH "\"candidates\": \\[\n    {\n.*\n  \\],\n  \"rows\": 438,\n  \"passing\": [0-9]+,\n  \"reasons\": \\[\\]\n}\n$")
