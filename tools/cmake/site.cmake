# fw_add_site_target(<module_dir> <dependency>): the always-run `site` target.
# tools/build-site copies web/ (without web/wasm/ and web/README.md), the
# module (fuelwright_core.mjs/.wasm from <module_dir>) and data/ into
# FW_SITE_DIR, and writes the service worker's precache list and version.
function(fw_add_site_target module_dir dependency)
  find_program(FW_NODE node REQUIRED)
  add_custom_target(site ALL
    COMMAND "${FW_NODE}" "${CMAKE_SOURCE_DIR}/tools/build-site"
            --web "${CMAKE_SOURCE_DIR}/web"
            --module "${module_dir}"
            --data "${CMAKE_SOURCE_DIR}/data"
            --out "${FW_SITE_DIR}"
    WORKING_DIRECTORY "${CMAKE_SOURCE_DIR}"
    COMMENT "Assembling the static site in ${FW_SITE_DIR}"
    VERBATIM)
  add_dependencies(site ${dependency})
endfunction()
