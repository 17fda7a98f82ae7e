// Catalog files from data/, compiled into the library so the native CLI and
// the WASM module read the same records without a file system.
#pragma once
#include <string_view>

namespace fw::detail {

/// Contents of data/<name> for the catalogs at the top of data/ (e.g. "species.json"); empty otherwise.
std::string_view embedded_file(std::string_view name) noexcept;

}  // namespace fw::detail
