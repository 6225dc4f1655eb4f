# What `cmake --install` puts under the prefix (architecture.md "Installed layout"), the CMake
# package a C++ user finds with find_package(coilfit), and the .deb that CPack builds from it.
include(CMakePackageConfigHelpers)

set(COILFIT_CMAKE_DIR ${CMAKE_INSTALL_LIBDIR}/cmake/coilfit)

# The program and what it reads at run time.
install(TARGETS coilfit RUNTIME DESTINATION ${CMAKE_INSTALL_BINDIR})
install(DIRECTORY parts/ DESTINATION ${CMAKE_INSTALL_DATADIR}/coilfit/parts FILES_MATCHING PATTERN "*.json")
# The JSON Schemas of the inputs and outputs, beside the table (written in src/schemas/).
if(EXISTS ${PROJECT_SOURCE_DIR}/src/schemas)
  install(DIRECTORY src/schemas/ DESTINATION ${CMAKE_INSTALL_DATADIR}/coilfit/schemas FILES_MATCHING PATTERN "*.json")
endif()
# The man page, written by hand; the build fills in the version.
configure_file(src/doc/coilfit.1.in ${PROJECT_BINARY_DIR}/coilfit.1 @ONLY)
install(FILES ${PROJECT_BINARY_DIR}/coilfit.1 DESTINATION ${CMAKE_INSTALL_MANDIR}/man1)
# Where bash-completion and zsh look for completions of a command.
install(FILES src/shell/coilfit.bash DESTINATION ${CMAKE_INSTALL_DATADIR}/bash-completion/completions RENAME coilfit)
install(FILES src/shell/_coilfit DESTINATION ${CMAKE_INSTALL_DATADIR}/zsh/vendor-completions)

# The core library: headers, the archive and the exported target coilfit::core, which needs
# nothing but the standard library (and its threads).
install(DIRECTORY include/coilfit DESTINATION ${CMAKE_INSTALL_INCLUDEDIR} FILES_MATCHING PATTERN "*.hpp")
install(TARGETS coilfit_core EXPORT coilfitTargets
        ARCHIVE DESTINATION ${CMAKE_INSTALL_LIBDIR}
        INCLUDES DESTINATION ${CMAKE_INSTALL_INCLUDEDIR})
install(EXPORT coilfitTargets NAMESPACE coilfit:: DESTINATION ${COILFIT_CMAKE_DIR})
configure_package_config_file(src/cmake/coilfitConfig.cmake.in ${PROJECT_BINARY_DIR}/coilfitConfig.cmake
                              INSTALL_DESTINATION ${COILFIT_CMAKE_DIR} PATH_VARS CMAKE_INSTALL_INCLUDEDIR)
# 0.x: a new minor version may change the API, so only the same minor version is compatible.
write_basic_package_version_file(${PROJECT_BINARY_DIR}/coilfitConfigVersion.cmake
                                 COMPATIBILITY SameMinorVersion)
install(FILES ${PROJECT_BINARY_DIR}/coilfitConfig.cmake ${PROJECT_BINARY_DIR}/coilfitConfigVersion.cmake
        DESTINATION ${COILFIT_CMAKE_DIR})

# `cpack -G DEB` in the build tree (or `cmake --build . --target package`). The program links
# fmt header-only and nothing else at run time, so the package needs only libc and libstdc++.
set(CPACK_PACKAGE_NAME coilfit)
set(CPACK_PACKAGE_VENDOR "the coilfit authors")
set(CPACK_PACKAGE_DESCRIPTION_SUMMARY "${PROJECT_DESCRIPTION}")
set(CPACK_PACKAGE_DESCRIPTION "coilfit sizes and checks the transistor driver, base or gate resistor and flyback clamp of a relay, contactor, solenoid or valve coil on a microcontroller pin, at worst case, and prints pass/fail reports as text or JSON. The package also holds the core library, its headers and CMake package (find_package(coilfit), target coilfit::core).")
set(CPACK_PACKAGE_CONTACT "coilfit maintainers")
set(CPACK_RESOURCE_FILE_LICENSE ${PROJECT_SOURCE_DIR}/LICENSE)
set(CPACK_GENERATOR DEB)
set(CPACK_PACKAGING_INSTALL_PREFIX /usr)
set(CPACK_DEBIAN_FILE_NAME DEB-DEFAULT)
set(CPACK_DEBIAN_PACKAGE_SECTION electronics)
set(CPACK_DEBIAN_PACKAGE_DEPENDS "libc6 (>= 2.34), libstdc++6 (>= 12), libgcc-s1")
set(CPACK_DEBIAN_PACKAGE_SUGGESTS "bash-completion, ngspice")
set(CPACK_STRIP_FILES bin/coilfit)
include(CPack)
