# fw_project_warnings(<target>): the warning set for project code.
# -Werror is added when FW_WARNINGS_AS_ERRORS is ON (the presets turn it on);
# it applies only to the targets named here, never to third-party code.
function(fw_project_warnings target)
  if(CMAKE_CXX_COMPILER_ID MATCHES "GNU|Clang")
    target_compile_options(${target} PRIVATE -Wall -Wextra)
    if(FW_WARNINGS_AS_ERRORS)
      target_compile_options(${target} PRIVATE -Werror)
    endif()
  endif()
endfunction()
