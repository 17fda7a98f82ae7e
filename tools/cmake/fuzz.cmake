# libFuzzer targets (clang only): preset `fuzz` builds the core with ASan + UBSan and coverage
# instrumentation and links one fuzzer per input kind (FW_FUZZ_TARGET 1..5 in the order listed). Run them with tools/fuzz.
set(FW_FUZZ_FLAGS -fsanitize=fuzzer-no-link,address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=undefined)
target_compile_options(core PRIVATE ${FW_FUZZ_FLAGS})
set(fw_fuzz_targets evaluate formula mixture prices scenario)
set(fw_fuzz_index 1)
foreach(name IN LISTS fw_fuzz_targets)
  add_executable(fuzz_${name} "${CMAKE_SOURCE_DIR}/tests/fuzz/fuzz_targets.cpp")
  target_compile_definitions(fuzz_${name} PRIVATE FW_FUZZ_TARGET=${fw_fuzz_index})
  target_compile_options(fuzz_${name} PRIVATE ${FW_FUZZ_FLAGS})
  target_link_options(fuzz_${name} PRIVATE -fsanitize=fuzzer,address,undefined)
  target_link_libraries(fuzz_${name} PRIVATE core)
  if(name STREQUAL "scenario")
    # Structure-aware: its own mutator changes scenarios field by field.
    target_sources(fuzz_${name} PRIVATE "${CMAKE_SOURCE_DIR}/tests/fuzz/scenario_mutator.cpp")
  endif()
  set_target_properties(fuzz_${name} PROPERTIES RUNTIME_OUTPUT_DIRECTORY "${CMAKE_BINARY_DIR}")
  math(EXPR fw_fuzz_index "${fw_fuzz_index} + 1")
endforeach()
