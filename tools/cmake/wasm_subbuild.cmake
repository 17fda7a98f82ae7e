# From a native build: build the WebAssembly module as a sub-build of this
# same source tree (build/wasm, Emscripten toolchain), assemble the site, and
# register the Node and browser tests.

include(ExternalProject)

set(FW_EMSCRIPTEN_TOOLCHAIN "/usr/share/emscripten/cmake/Modules/Platform/Emscripten.cmake"
  CACHE FILEPATH "Emscripten's CMake toolchain file")
set(FW_WASM_BINARY_DIR "${CMAKE_SOURCE_DIR}/build/wasm" CACHE PATH "Binary folder of the WASM sub-build")
find_program(FW_NODE node REQUIRED)

ExternalProject_Add(wasm
  SOURCE_DIR "${CMAKE_SOURCE_DIR}"
  BINARY_DIR "${FW_WASM_BINARY_DIR}"
  PREFIX "${CMAKE_BINARY_DIR}/wasm-subbuild"
  CMAKE_ARGS
    "-DCMAKE_TOOLCHAIN_FILE=${FW_EMSCRIPTEN_TOOLCHAIN}"
    # emcmake's default emulator passes a flag Node 20 rejects.
    "-DCMAKE_CROSSCOMPILING_EMULATOR=${FW_NODE}"
    -DCMAKE_BUILD_TYPE=MinSizeRel
    "-DFW_WARNINGS_AS_ERRORS=${FW_WARNINGS_AS_ERRORS}"
    -DFW_WASM_SUBBUILD=ON
  BUILD_ALWAYS ON
  INSTALL_COMMAND ""
  TEST_COMMAND "")

include(site)
fw_add_site_target("${FW_WASM_BINARY_DIR}" wasm)

# The WASM module in Node, compared with the native CLI on the same inputs.
add_test(NAME node_wasm
  COMMAND "${FW_NODE}" --test --test-reporter=spec "${CMAKE_SOURCE_DIR}/tests/node/"
  WORKING_DIRECTORY "${CMAKE_SOURCE_DIR}")
set_tests_properties(node_wasm PROPERTIES
  ENVIRONMENT "FUELWRIGHT_SITE=${FW_SITE_DIR};FUELWRIGHT_CLI=$<TARGET_FILE:fuelwright>"
  LABELS wasm
  TIMEOUT 120)

# One test file of tests/browser/ run by Node as its own ctest test.
function(fw_node_browser_test name file)
  add_test(NAME ${name}
    COMMAND "${FW_NODE}" --test --test-reporter=spec "${CMAKE_SOURCE_DIR}/tests/browser/${file}"
    WORKING_DIRECTORY "${CMAKE_SOURCE_DIR}")
endfunction()

# The page in three engines, each its own test: headless Chromium
# (playwright-core), WebKitGTK's WebDriver under Xvfb (selenium-webdriver) and
# Firefox ESR through WebDriver BiDi (ws). Screenshots go to build/test-artifacts.
set(FW_CHROMIUM "/usr/bin/chromium" CACHE FILEPATH "Chromium used by the browser tests")
find_program(FW_XVFB_RUN xvfb-run)
set(FW_BROWSER_ENV "FUELWRIGHT_SITE=${FW_SITE_DIR};FUELWRIGHT_CLI=$<TARGET_FILE:fuelwright>;FUELWRIGHT_CHROMIUM=${FW_CHROMIUM};FUELWRIGHT_ARTIFACTS=${CMAKE_SOURCE_DIR}/build/test-artifacts")
fw_node_browser_test(browser_chromium chromium.test.js)
add_test(NAME browser_webkit
  COMMAND "${FW_XVFB_RUN}" -a -s "-screen 0 1280x1024x24"
          "${FW_NODE}" --test --test-reporter=spec "${CMAKE_SOURCE_DIR}/tests/browser/webkit.test.js"
  WORKING_DIRECTORY "${CMAKE_SOURCE_DIR}")
fw_node_browser_test(browser_firefox firefox.test.js)
# The House tab's bills as printed, weather file and climate library, in Chromium.
fw_node_browser_test(browser_chromium_climates climates.test.js)
# Heat pumps and fuel-burning equipment as rated and sold (issue 13), in Chromium.
fw_node_browser_test(browser_chromium_equipment equipment.test.js)
# Entries that need attention: the out-of-date verdict, slips asked about, the jump to a field, in Chromium.
fw_node_browser_test(browser_chromium_attention attention.test.js)
# The printed quote sheet (Chromium's PDF read back with pdftotext), in Chromium.
fw_node_browser_test(browser_chromium_sheet sheet.test.js)
# The issue-14 quote entered end to end by taps and typing, counted, kept and printed, in Chromium.
fw_node_browser_test(browser_chromium_quote quote-walk.test.js)
# Saved quotes of earlier and later record versions, and a full storage, in Chromium.
fw_node_browser_test(browser_storage storage.test.js)
# Hot water and time-of-use electricity entered by taps, against the CLI, on paper (issue 16), in Chromium.
fw_node_browser_test(browser_chromium_water water-and-time-of-use.test.js)
set_tests_properties(browser_chromium browser_chromium_climates browser_chromium_equipment browser_chromium_attention browser_chromium_sheet browser_chromium_quote browser_chromium_water browser_webkit browser_firefox browser_storage PROPERTIES
  ENVIRONMENT "${FW_BROWSER_ENV}"
  LABELS browser
  TIMEOUT 240
  RESOURCE_LOCK browser_site)

# Text typed in, imported or read from a price file shown as text and never run;
# requests only to the site's own origin, and none once the page has loaded offline.
fw_node_browser_test(browser_security security.test.js)
set_tests_properties(browser_security PROPERTIES
  ENVIRONMENT "${FW_BROWSER_ENV}"
  LABELS browser
  TIMEOUT 240
  RESOURCE_LOCK browser_site)

# The built site behind nginx with deploy/nginx.conf (nginx in the foreground on a
# free loopback port, temporary prefix), and the kiosk in Chromium against it.
find_program(FW_NGINX nginx PATHS /usr/sbin /usr/local/sbin)
add_test(NAME kiosk_nginx
  COMMAND "${FW_NODE}" --test --test-reporter=spec "${CMAKE_SOURCE_DIR}/tests/deploy/kiosk-nginx.test.js"
  WORKING_DIRECTORY "${CMAKE_SOURCE_DIR}")
set_tests_properties(kiosk_nginx PROPERTIES
  ENVIRONMENT "${FW_BROWSER_ENV};FUELWRIGHT_NGINX=${FW_NGINX}"
  LABELS "browser;deploy"
  TIMEOUT 180
  RESOURCE_LOCK browser_site)
