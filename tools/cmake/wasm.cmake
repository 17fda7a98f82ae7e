# The WebAssembly build (CMAKE_TOOLCHAIN_FILE = Emscripten.cmake). Included from
# the top-level CMakeLists.txt after the `core` library is defined.
# Every Emscripten-specific flag of the project lives in this file.

# Debian's emcc runs JavaScript tools (acorn, terser) with the machine's node,
# which does not search Debian's /usr/share/nodejs: point it there for the link.
set(CMAKE_CXX_LINKER_LAUNCHER "${CMAKE_COMMAND}" -E env NODE_PATH=/usr/share/nodejs)

# Never let /usr/include reach em++ (glibc headers would leak in): re-point the
# host's nlohmann_json target at a folder holding only a link to its headers.
get_target_property(fw_nlohmann_include nlohmann_json::nlohmann_json INTERFACE_INCLUDE_DIRECTORIES)
list(GET fw_nlohmann_include 0 fw_nlohmann_include)
set(fw_nlohmann_shim "${CMAKE_BINARY_DIR}/nlohmann-include")
file(MAKE_DIRECTORY "${fw_nlohmann_shim}")
if(NOT EXISTS "${fw_nlohmann_shim}/nlohmann")
  file(CREATE_LINK "${fw_nlohmann_include}/nlohmann" "${fw_nlohmann_shim}/nlohmann" SYMBOLIC)
endif()
set_target_properties(nlohmann_json::nlohmann_json PROPERTIES
  INTERFACE_INCLUDE_DIRECTORIES "${fw_nlohmann_shim}"
  INTERFACE_SYSTEM_INCLUDE_DIRECTORIES "${fw_nlohmann_shim}")

# Compile flags for all WASM code (core and bindings). Debian's emscripten 3.1.6 defaults to
# -fignore-exceptions; the core relies on catching its own exceptions, so exceptions must be on
# at compile and link time. Native WebAssembly exceptions (-fwasm-exceptions; Chrome 95+,
# Safari 15.2+, Firefox 100+, Node 17+) replace the JavaScript-based ones of -fexceptions, which
# route every call inside a try block through JS (heavy benchmark 503 -> 340 ms when introduced).
# The build type (MinSizeRel) puts -Os first; -O2 after it sets clang's level, but emcc keeps the
# -Os side effect of -fno-inline-functions (emcc.py: INLINING_LIMIT=1), lifted below for the hot files.
# -flto lets the linker drop and merge template code across files. -sDYNAMIC_EXECUTION=0 keeps
# eval and new Function out of the glue, so the page's Content-Security-Policy needs no 'unsafe-eval'.
set(FW_WASM_COMPILE_OPTIONS -O2 -flto -fwasm-exceptions)
# Link flags of the module: an ES6 factory `createFuelwrightCore`, web only
# (Node tests pass the .wasm bytes as `wasmBinary`), no virtual file system.
set(FW_WASM_LINK_OPTIONS
  -O2
  -flto
  -fwasm-exceptions
  -lembind
  -sMODULARIZE=1
  -sEXPORT_ES6=1
  -sEXPORT_NAME=createFuelwrightCore
  -sENVIRONMENT=web
  -sALLOW_MEMORY_GROWTH=1
  -sFILESYSTEM=0
  -sDYNAMIC_EXECUTION=0)

target_compile_options(core PRIVATE ${FW_WASM_COMPILE_OPTIONS})
# The build type's -Os makes emcc add -fno-inline-functions (its INLINING_LIMIT), which keeps the
# module small (~215 KB gzip) but leaves even iterator increments as calls. The files where the
# heavy analyses spend their time (bins, Monte Carlo, quantiles, sweeps) are compiled with inlining.
# Measured on the heavy benchmark: without this 71 ms and 217 KB gzip, with it 27 ms and 260 KB; inlining
# everywhere 24 ms and 308 KB; adding the JSON-building files (scenario, evaluate_api, json_fields) gained nothing.
set(FW_WASM_HOT_SOURCES climate/heat_pump.cpp model/heat_pump_option.cpp model/appraisal.cpp model/economics.cpp climate/climate.cpp model/analysis.cpp)
list(TRANSFORM FW_WASM_HOT_SOURCES PREPEND "${CMAKE_SOURCE_DIR}/core/src/")
set_source_files_properties(${FW_WASM_HOT_SOURCES} TARGET_DIRECTORY core PROPERTIES COMPILE_OPTIONS -finline-functions)

# The module: fuelwright_core.mjs + fuelwright_core.wasm in the build folder.
add_executable(fuelwright_core "${CMAKE_SOURCE_DIR}/web/wasm/bindings.cpp")
target_link_libraries(fuelwright_core PRIVATE core)
target_compile_options(fuelwright_core PRIVATE ${FW_WASM_COMPILE_OPTIONS})
target_link_options(fuelwright_core PRIVATE ${FW_WASM_LINK_OPTIONS})
set_target_properties(fuelwright_core PROPERTIES
  SUFFIX ".mjs"
  RUNTIME_OUTPUT_DIRECTORY "${CMAKE_BINARY_DIR}")
fw_project_warnings(fuelwright_core)

# A stand-alone WASM build (preset `wasm`) also assembles the site; when this
# is the sub-build of a native build, the native build assembles it instead.
if(NOT FW_WASM_SUBBUILD)
  include(site)
  fw_add_site_target("${CMAKE_BINARY_DIR}" fuelwright_core)
endif()
