# Checks that an install prefix holds the layout of architecture.md "Installed layout".
#   cmake -DPREFIX=dir -P install_layout.cmake
set(expected
  bin/coilfit
  share/coilfit/parts/bipolar.json
  share/coilfit/parts/diodes.json
  share/man/man1/coilfit.1
  share/bash-completion/completions/coilfit
  share/zsh/vendor-completions/_coilfit
  include/coilfit/sizing.hpp
  include/coilfit/report.hpp
  include/coilfit/drivers/bipolar.hpp
  lib/libcoilfit_core.a
  lib/cmake/coilfit/coilfitConfig.cmake
  lib/cmake/coilfit/coilfitConfigVersion.cmake
  lib/cmake/coilfit/coilfitTargets.cmake)
set(missing)
foreach(f IN LISTS expected)
  if(NOT EXISTS ${PREFIX}/${f})
    list(APPEND missing ${f})
  endif()
endforeach()
# The schemas ship once src/schemas/ exists.
get_filename_component(source_dir ${CMAKE_CURRENT_LIST_DIR}/.. ABSOLUTE)
file(GLOB schemas RELATIVE ${source_dir}/src/schemas ${source_dir}/src/schemas/*.json)
foreach(s IN LISTS schemas)
  if(NOT EXISTS ${PREFIX}/share/coilfit/schemas/${s})
    list(APPEND missing share/coilfit/schemas/${s})
  endif()
endforeach()
# Nothing of the build's private libraries or the io layer is installed.
file(GLOB_RECURSE private RELATIVE ${PREFIX} ${PREFIX}/lib/*coilfit_io* ${PREFIX}/include/io/*)
if(missing OR private)
  message(FATAL_ERROR "missing under ${PREFIX}: ${missing}\nnot to be installed: ${private}")
endif()
