#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <map>
#include <set>

#include "climate/demand.hpp"
#include "base/units.hpp"
#include "climate/weather.hpp"

namespace fw {

namespace {

enum class role { none, date, time, mean, max, min, temperature, station };

/// The fields of one CSV line split at `delimiter`, double quotes grouping (RFC 4180; "" inside quotes is a quote).
std::vector<std::string> split_line(const std::string& line, char delimiter) {
    std::vector<std::string> out(1);
    bool quoted = false;
    for (std::size_t i = 0; i < line.size(); ++i) {
        const char c = line[i];
        if (c == '"') {
            if (quoted && i + 1 < line.size() && line[i + 1] == '"') {
                out.back() += '"';
                ++i;
            } else {
                quoted = !quoted;
            }
        } else if (c == delimiter && !quoted) {
            out.emplace_back();
        } else {
            out.back() += c;
        }
    }
    for (auto& field : out) {
        const auto first = field.find_first_not_of(" \t");
        const auto last = field.find_last_not_of(" \t");
        field = first == std::string::npos ? "" : field.substr(first, last - first + 1);
    }
    return out;
}

/// The file's lines without line ends (LF, CRLF or CR) and without a UTF-8 byte-order mark.
std::vector<std::string> lines_of(const std::string& text) {
    std::vector<std::string> out;
    std::size_t start = text.rfind("\xEF\xBB\xBF", 0) == 0 ? 3 : 0;
    for (std::size_t i = start; i <= text.size(); ++i) {
        if (i == text.size() || text[i] == '\n' || text[i] == '\r') {
            out.push_back(text.substr(start, i - start));
            if (i + 1 < text.size() && text[i] == '\r' && text[i + 1] == '\n') ++i;
            start = i + 1;
        }
    }
    while (!out.empty() && out.back().empty()) out.pop_back();
    return out;
}

/// A header name lower-cased with every run of other characters than letters and digits made one space.
std::string normalized(const std::string& name) {
    std::string out;
    for (unsigned char c : name) {
        if (std::isalnum(c)) out += static_cast<char>(std::tolower(c));
        else if (!out.empty() && out.back() != ' ') out += ' ';
    }
    while (!out.empty() && out.back() == ' ') out.pop_back();
    return out;
}

bool has(const std::string& text, const char* part) { return text.find(part) != std::string::npos; }

bool starts(const std::string& text, const char* part) { return text.rfind(part, 0) == 0; }

/// What a column holds, from its header (common spellings of national weather services' exports).
role role_of(const std::string& header) {
    const auto n = normalized(header);
    for (const char* other : {"flag", "quality", "attributes", "source", "uncert", "dew", "wet", "heat index", "wind chill",
                              "humid", "count", "days", "qc", "missing"})
        if (has(n, other)) return role::none;
    if (n == "date" || n == "datetime" || n == "timestamp" || n == "time stamp" || n == "valid" || n == "mess datum" ||
        n == "obs date" || n == "observation date" || n == "local date" || starts(n, "date "))
        return role::date;
    if (n == "time" || starts(n, "time ") || n == "hour" || n == "hh mm") return role::time;
    if (n == "tmax" || n == "txk" || n == "tx" || has(n, "max temp") || has(n, "maximum temp") || has(n, "temp max") ||
        has(n, "temperature max") || starts(n, "tmax "))
        return role::max;
    if (n == "tmin" || n == "tnk" || n == "tn" || has(n, "min temp") || has(n, "minimum temp") || has(n, "temp min") ||
        has(n, "temperature min") || starts(n, "tmin "))
        return role::min;
    if (n == "tavg" || n == "tmean" || n == "tmk" || n == "tg" || has(n, "mean temp") || has(n, "avg temp") ||
        has(n, "average temp") || has(n, "mean air temp") || has(n, "temp mean") || has(n, "temperature mean") ||
        starts(n, "tavg ") || starts(n, "tmean "))
        return role::mean;
    if (has(n, "dry bulb") || has(n, "drybulb") || n == "tmpf" || n == "tmpc" || n == "tt tu" || n == "temp" ||
        n == "temperature" || n == "air temp" || n == "air temperature" || n == "t2m" || starts(n, "temp ") ||
        starts(n, "temperature ") || starts(n, "air temp"))
        return role::temperature;
    if (n == "station" || n == "station id" || n == "stations id" || n == "climate id" || n == "wmo id") return role::station;
    return role::none;
}

/// The unit a header names for its temperatures: true for degF, false for degC, nullopt when it names none.
std::optional<bool> unit_of(const std::string& header) {
    std::string n;
    for (unsigned char c : header) n += static_cast<char>(std::tolower(c));
    if (has(n, "\xC2\xB0" "f") || has(n, "(f)") || has(n, "degf") || has(n, "deg f") || has(n, "fahrenheit") || n == "tmpf")
        return true;
    if (has(n, "\xC2\xB0" "c") || has(n, "(c)") || has(n, "degc") || has(n, "deg c") || has(n, "celsius") || n == "tmpc" ||
        normalized(header) == "tt tu" || normalized(header) == "tmk" || normalized(header) == "txk" || normalized(header) == "tnk")
        return false;
    return std::nullopt;
}

/// A temperature field: nullopt when empty or a missing-value code; a trailing quality letter or '*' is dropped
/// (counted in `flagged`); decimal commas are read when the file's delimiter is not a comma.
std::optional<double> temperature_field(std::string text, bool decimal_comma, int& flagged) {
    if (text.empty()) return std::nullopt;
    std::string lower;
    for (unsigned char c : text) lower += static_cast<char>(std::tolower(c));
    for (const char* missing : {"m", "na", "n/a", "nan", "-", "--", "null", "missing", "t"})
        if (lower == missing) return std::nullopt;
    if (decimal_comma) std::replace(text.begin(), text.end(), ',', '.');
    bool stripped = false;
    while (!text.empty() && (std::isalpha(static_cast<unsigned char>(text.back())) || text.back() == '*')) {
        text.pop_back();
        stripped = true;
    }
    if (text.empty()) return std::nullopt;
    char* end = nullptr;
    const double value = std::strtod(text.c_str(), &end);
    if (end == text.c_str() || *end != '\0' || !std::isfinite(value)) return std::nullopt;
    // Missing-value codes of common exports: -9999, -999, -99.9, 9999, 999.9, -9900.
    for (double code : {-9999.0, -999.0, -99.9, 9999.0, 999.9, -9900.0, 99999.0})
        if (value == code) return std::nullopt;
    if (stripped) ++flagged;
    return value;
}

bool all_digits(const std::string& text) {
    return !text.empty() && std::all_of(text.begin(), text.end(), [](unsigned char c) { return std::isdigit(c); });
}

bool separator_is_slash(const std::string& text) { return text.find('/') != std::string::npos; }

/// The hour of a time of day "HH:MM[:SS]", "HHMM" or "H:MM AM/PM" (12 AM is hour 0, 12 PM hour 12), and its
/// minutes in `minute` (0 where the text has none); throws input_error at `path` quoting `raw`.
int hour_of(std::string time, const std::string& path, const std::string& raw, int& minute) {
    std::string lower;
    for (unsigned char c : time) lower += static_cast<char>(std::tolower(c));
    int shift = -1;  // -1: a 24-hour clock
    if (lower.size() >= 2 && (lower.compare(lower.size() - 2, 2, "am") == 0 || lower.compare(lower.size() - 2, 2, "pm") == 0)) {
        shift = lower.compare(lower.size() - 2, 2, "pm") == 0 ? 12 : 0;
        time = time.substr(0, time.size() - 2);
        while (!time.empty() && time.back() == ' ') time.pop_back();
    }
    const auto colon = time.find(':');
    const std::string hh = colon == std::string::npos ? (time.size() > 2 ? time.substr(0, time.size() - 2) : time) : time.substr(0, colon);
    if (!all_digits(hh)) throw input_error(path, "\"" + raw + "\" has a time this reader does not know (HH:MM, or H:MM AM/PM)");
    const std::string mm = colon == std::string::npos ? (time.size() > 2 ? time.substr(time.size() - 2) : "") : time.substr(colon + 1, 2);
    minute = mm.size() == 2 && all_digits(mm) ? std::min(59, std::atoi(mm.c_str())) : 0;
    int hour = std::atoi(hh.c_str());
    if (shift >= 0) {
        if (hour < 1 || hour > 12) throw input_error(path, "\"" + raw + "\" has an hour outside 1 to 12 before AM/PM");
        hour = hour % 12 + shift;
    }
    if (hour > 24) throw input_error(path, "\"" + raw + "\" has an hour above 24");
    return hour;
}

/// A date (and hour where the text has one) in the spellings weather exports use: YYYY-MM-DD, YYYY/MM/DD,
/// YYYYMMDD[HH[MM]], MM/DD/YYYY, DD.MM.YYYY, each optionally followed by T or a space and HH:MM[:SS].
/// Returns the day number and sets `hour` (-1 when the text has no time); throws input_error at `path`.
long parse_when(const std::string& raw, int& hour, int& minute, const std::string& path) {
    std::string text = raw;
    hour = -1;
    minute = 0;
    std::string date = text, time;
    if (const auto cut = text.find_first_of("T "); cut != std::string::npos && cut >= 8) {
        date = text.substr(0, cut);
        time = text.substr(cut + 1);
    }
    std::string iso;
    if (all_digits(date) && (date.size() == 8 || date.size() == 10 || date.size() == 12)) {
        iso = date.substr(0, 4) + "-" + date.substr(4, 2) + "-" + date.substr(6, 2);
        if (date.size() >= 10) hour = std::atoi(date.substr(8, 2).c_str());
        if (date.size() == 12) minute = std::min(59, std::atoi(date.substr(10, 2).c_str()));
    } else if (date.size() == 10 && (date[4] == '-' || date[4] == '/') && date[7] == date[4]) {
        iso = date.substr(0, 4) + "-" + date.substr(5, 2) + "-" + date.substr(8, 2);
    } else {
        const char separator = date.find('/') != std::string::npos ? '/' : date.find('.') != std::string::npos ? '.' : '\0';
        const auto parts = separator ? split_line(date, separator) : std::vector<std::string>{};
        if (parts.size() != 3 || parts[2].size() != 4 || !all_digits(parts[0]) || !all_digits(parts[1]) || !all_digits(parts[2]) ||
            parts[0].size() > 2 || parts[1].size() > 2)
            throw input_error(path, "\"" + raw + "\" is not a date this reader knows (YYYY-MM-DD, MM/DD/YYYY, DD.MM.YYYY or YYYYMMDD)");
        const auto two = [](const std::string& s) { return s.size() == 1 ? "0" + s : s; };
        // Slashes are read month first (MM/DD/YYYY, as US services print them), dots day first (DD.MM.YYYY).
        iso = parts[2] + "-" + two(separator == '/' ? parts[0] : parts[1]) + "-" + two(separator == '/' ? parts[1] : parts[0]);
    }
    if (!time.empty()) hour = hour_of(time, path, raw, minute);
    if (hour > 24) throw input_error(path, "\"" + raw + "\" has an hour above 24");
    try {
        return parse_day_number(iso, path);
    } catch (const input_error& error) {
        throw input_error(path, "\"" + raw + "\": " + error.message() +
                                    (separator_is_slash(raw) ? " (dates with slashes are read month first, MM/DD/YYYY)" : ""));
    }
}

/// One data row as read.
struct weather_row {
    long day;
    int hour;    ///< -1: none
    int minute;  ///< of the hour, 0 where the file gives none
    std::optional<double> mean, max, min, temperature;  ///< in the file's unit
    std::size_t line;  ///< 1-based
};

/// The header's columns by role; a column named in `chosen` wins over recognition.
struct column_map {
    std::map<role, std::size_t> index;
    std::optional<bool> fahrenheit;  ///< what the temperature headers say
    std::string unit_header;         ///< the header that said it
};

/// The column of `name` (case-insensitive) in the header, or an input_error at `path`.
std::size_t named_column(const std::vector<std::string>& header, const std::string& name, const std::string& path) {
    for (std::size_t i = 0; i < header.size(); ++i)
        if (normalized(header[i]) == normalized(name)) return i;
    std::string known;
    for (const auto& h : header) known += (known.empty() ? "" : ", ") + h;
    throw input_error(path, "no column is named \"" + name + "\"; the header has " + known);
}

column_map map_columns(const std::vector<std::string>& header, const weather_columns& chosen) {
    column_map out;
    for (std::size_t i = 0; i < header.size(); ++i) {
        const role r = role_of(header[i]);
        if (r != role::none && !out.index.count(r)) out.index[r] = i;
    }
    const std::pair<const std::string*, role> given[] = {{&chosen.date, role::date},   {&chosen.time, role::time},
                                                          {&chosen.mean, role::mean},   {&chosen.max, role::max},
                                                          {&chosen.min, role::min},     {&chosen.temperature, role::temperature}};
    const char* keys[] = {"date", "time", "mean", "max", "min", "temperature"};
    for (std::size_t k = 0; k < 6; ++k)
        if (!given[k].first->empty())
            out.index[given[k].second] = named_column(header, *given[k].first, std::string("/columns/") + keys[k]);
    for (role r : {role::mean, role::max, role::min, role::temperature}) {
        const auto found = out.index.find(r);
        if (found == out.index.end()) continue;
        if (const auto unit = unit_of(header[found->second]); unit && !out.fahrenheit) {
            out.fahrenheit = unit;
            out.unit_header = header[found->second];
        }
    }
    return out;
}

/// The header line's delimiter: the most frequent of comma, semicolon and tab outside quotes.
char delimiter_of(const std::string& line) {
    int comma = 0, semicolon = 0, tab = 0;
    bool quoted = false;
    for (char c : line) {
        if (c == '"') quoted = !quoted;
        else if (!quoted) comma += c == ',', semicolon += c == ';', tab += c == '\t';
    }
    if (semicolon > comma && semicolon >= tab) return ';';
    if (tab > comma) return '\t';
    return ',';
}

std::string list_text(const std::vector<std::string>& items) {
    std::string out;
    for (const auto& item : items) out += (out.empty() ? "" : ", ") + item;
    return out;
}

std::string count_text(std::size_t n, const char* one, const char* many) {
    return std::to_string(n) + " " + (n == 1 ? one : many);
}

}  // namespace

double hourly_quantile(std::vector<double> hours_c, double fraction) {
    if (hours_c.empty()) return 0;
    std::sort(hours_c.begin(), hours_c.end());
    const double position = fraction * static_cast<double>(hours_c.size() - 1);
    const auto below = static_cast<std::size_t>(std::floor(position));
    const std::size_t above = std::min(below + 1, hours_c.size() - 1);
    return hours_c[below] + (position - static_cast<double>(below)) * (hours_c[above] - hours_c[below]);
}

weather_series read_weather_csv(const std::string& text, const weather_read_options& options) {
    if (text.size() > max_weather_bytes)
        throw input_error("/text", "the file is " + std::to_string(text.size() / (1u << 20)) + " MB; at most " +
                                       std::to_string(max_weather_bytes >> 20) + " MB are read (export fewer years or columns)");
    const auto lines = lines_of(text);
    if (lines.empty()) throw input_error("/text", "the file is empty");
    weather_series series;
    // The header: the TMY3 layout's second line (its first holds the station), or the first of the
    // first 40 lines with a date column and a temperature column.
    std::size_t header_line = lines.size();
    char delimiter = ',';
    std::vector<std::string> header;
    column_map columns;
    if (lines.size() > 1 && lines[1].rfind("Date (MM/DD/YYYY)", 0) == 0) {
        const auto station = split_line(lines[0], ',');
        if (station.size() >= 3) series.station = station[1] + ", " + station[2];
        header_line = 1;
        header = split_line(lines[1], ',');
        columns = map_columns(header, options.columns);
        series.notes.push_back("TMY3 layout (station on the first line, the header on the second)");
    } else {
        for (std::size_t i = 0; i < std::min<std::size_t>(lines.size(), 40); ++i) {
            const char d = delimiter_of(lines[i]);
            auto fields = split_line(lines[i], d);
            auto mapped = map_columns(fields, options.columns);
            // A "time" column holding full timestamps (and no date column) is the date column.
            if (!mapped.index.count(role::date) && mapped.index.count(role::time) && i + 1 < lines.size()) {
                const auto next = split_line(lines[i + 1], d);
                const auto c = mapped.index.at(role::time);
                if (c < next.size() && next[c].size() >= 10 && std::isdigit(static_cast<unsigned char>(next[c][0])) &&
                    (next[c][4] == '-' || next[c][4] == '/')) {
                    mapped.index[role::date] = c;
                    mapped.index.erase(role::time);
                }
            }
            const bool temperatures = mapped.index.count(role::mean) || mapped.index.count(role::max) ||
                                      mapped.index.count(role::min) || mapped.index.count(role::temperature);
            if (mapped.index.count(role::date) && temperatures) {
                header_line = i;
                delimiter = d;
                header = std::move(fields);
                columns = std::move(mapped);
                break;
            }
        }
        if (header_line == lines.size())
            throw input_error("/text", "no header line names a date column and a temperature column (such as DATE with TAVG, "
                                       "TMAX and TMIN, or a date and a dry-bulb temperature); give the columns to read");
    }
    const auto column = [&](role r) -> std::optional<std::size_t> {
        const auto found = columns.index.find(r);
        return found == columns.index.end() ? std::nullopt : std::optional<std::size_t>(found->second);
    };
    // The unit: what the header says wins; otherwise the one asked for.
    if (columns.fahrenheit) {
        series.fahrenheit = *columns.fahrenheit;
        series.notes.push_back(std::string("temperatures in ") + (series.fahrenheit ? "degF" : "degC") + ", as the column \"" +
                               columns.unit_header + "\" says");
        if (options.fahrenheit && *options.fahrenheit != series.fahrenheit)
            series.warnings.push_back({"/unit", std::string("the file says its temperatures are in ") +
                                                    (series.fahrenheit ? "degF" : "degC") + " (column \"" + columns.unit_header +
                                                    "\"); they are read so, not in the unit chosen"});
    } else if (options.fahrenheit) {
        series.fahrenheit = *options.fahrenheit;
        series.notes.push_back(std::string("temperatures in ") + (series.fahrenheit ? "degF" : "degC") + ", as chosen");
    } else {
        throw input_error("/unit", "the file does not say whether its temperatures are in degC or degF; choose the unit");
    }
    const auto date_col = *column(role::date);
    const auto time_col = column(role::time);
    const auto mean_col = column(role::mean), max_col = column(role::max), min_col = column(role::min);
    const auto temp_col = column(role::temperature);
    const auto station_col = column(role::station);
    std::vector<std::string> read;
    for (auto [r, name] : {std::pair{role::date, "date"}, {role::time, "time"}, {role::mean, "mean"}, {role::max, "max"},
                           {role::min, "min"}, {role::temperature, "hourly temperature"}})
        if (const auto c = column(r)) read.push_back(std::string(name) + " \"" + header[*c] + "\"");
    series.notes.push_back("columns read: " + list_text(read));
    const bool decimal_comma = delimiter != ',';
    int flagged = 0;
    std::size_t missing = 0, implausible = 0, first_implausible = 0, one_sided = 0;
    std::set<std::string> stations;
    std::vector<weather_row> rows;
    const double low = series.fahrenheit ? -94 : -70, high = series.fahrenheit ? 140 : 60;
    for (std::size_t i = header_line + 1; i < lines.size(); ++i) {
        if (lines[i].empty() || lines[i][0] == '#') continue;
        const auto fields = split_line(lines[i], delimiter);
        const std::string at = "/text";
        const std::string where = "line " + std::to_string(i + 1) + ": ";
        if (date_col >= fields.size()) throw input_error(at, where + "has no date column (" + std::to_string(fields.size()) + " fields)");
        weather_row row{};
        row.line = i + 1;
        try {
            row.day = parse_when(fields[date_col], row.hour, row.minute, at);
            if (time_col && *time_col < fields.size() && !fields[*time_col].empty())
                row.hour = hour_of(fields[*time_col], at, fields[*time_col], row.minute);
        } catch (const input_error& error) {
            throw input_error(at, where + error.message());
        }
        const auto value = [&](std::optional<std::size_t> c) -> std::optional<double> {
            if (!c || *c >= fields.size()) return std::nullopt;
            auto v = temperature_field(fields[*c], decimal_comma, flagged);
            if (v && (*v < low || *v > high)) {
                if (implausible++ == 0) first_implausible = i + 1;
                return std::nullopt;
            }
            return v;
        };
        row.mean = value(mean_col);
        row.max = value(max_col);
        row.min = value(min_col);
        row.temperature = value(temp_col);
        if (row.max && row.min && *row.min > *row.max) row.max = row.min = std::nullopt;
        if (bool(row.max) != bool(row.min) && !row.mean && !row.temperature) ++one_sided;
        if (station_col && *station_col < fields.size() && !fields[*station_col].empty()) stations.insert(fields[*station_col]);
        if (!row.mean && !(row.max && row.min) && !row.temperature) {
            ++missing;
            continue;
        }
        rows.push_back(row);
    }
    if (stations.size() > 1) {
        std::vector<std::string> names(stations.begin(), stations.end());
        if (names.size() > 4) names.resize(4), names.push_back("...");
        throw input_error("/text", "the file holds " + std::to_string(stations.size()) + " stations (" + list_text(names) +
                                       "); export one station at a time");
    }
    if (series.station.empty() && !stations.empty()) series.station = *stations.begin();
    if (rows.empty()) throw input_error("/text", "no row has a temperature (" + count_text(missing, "row was", "rows were") + " empty)");
    // Daily or hourly: as asked, or hourly when there are many rows a day.
    std::set<long> distinct;
    for (const auto& row : rows) distinct.insert(row.day);
    const double per_day = static_cast<double>(rows.size()) / static_cast<double>(distinct.size());
    const bool daily_columns = mean_col || (max_col && min_col);
    series.format = options.format.value_or(per_day > 4 || (!daily_columns && temp_col) ? weather_format::hourly : weather_format::daily);
    if (series.format == weather_format::hourly && !temp_col && !mean_col)
        throw input_error("/format", "an hourly file needs a temperature column (such as a dry-bulb temperature)");
    if (options.format == weather_format::daily && per_day > 1.5)
        throw input_error("/format", "the file has " + format_fixed(per_day, 1) + " rows a day: read it as hourly");
    if (series.format == weather_format::daily && !daily_columns && !temp_col)
        throw input_error("/text", "a daily file needs a mean column, or max and min columns");
    if (missing > 0)
        series.warnings.push_back({"/text", count_text(missing, "row has", "rows have") + " no temperature and " +
                                                (missing == 1 ? "was" : "were") + " skipped" +
                                                (one_sided > 0 ? " (" + std::to_string(one_sided) + " of them only a maximum or "
                                                                 "only a minimum: a daily mean needs both)"
                                                               : "")});
    if (implausible > 0)
        series.warnings.push_back({"/text", count_text(implausible, "value lies", "values lie") +
                                                " outside any outdoor temperature and " + (implausible == 1 ? "was" : "were") +
                                                " read as missing (first on line " + std::to_string(first_implausible) + ")"});
    if (flagged > 0)
        series.warnings.push_back({"/text", count_text(static_cast<std::size_t>(flagged), "value carries", "values carry") +
                                                " a quality letter after the number; the number was read"});
    const auto to_c = [&](double t) { return series.fahrenheit ? (t - 32) * 5.0 / 9.0 : t; };
    const double to_k = series.fahrenheit ? 5.0 / 9.0 : 1.0;
    if (series.format == weather_format::daily) {
        std::map<long, std::size_t> seen;
        for (const auto& row : rows) {
            if (const auto [it, fresh] = seen.emplace(row.day, row.line); !fresh)
                throw input_error("/text", "line " + std::to_string(row.line) + ": the day " + day_text(row.day) +
                                               " appears again (first on line " + std::to_string(it->second) +
                                               "); a daily file has one row a day");
            weather_day day;
            day.day = row.day;
            // (max + min) / 2 where both are given: the daily mean degree-days are reckoned on in NWS practice.
            if (row.max && row.min) {
                day.mean_c = to_c(0.5 * (*row.max + *row.min));
                day.range_k = (*row.max - *row.min) * to_k;
            } else {
                day.mean_c = to_c(row.mean ? *row.mean : *row.temperature);
            }
            series.days.push_back(day);
        }
        series.notes.push_back(max_col && min_col ? "daily mean = (max + min) / 2 where both are given" : "daily means as given");
    } else {
        // One reading an hour (the first where a file has several in one hour); daily means from days with 18+ hours.
        std::map<std::pair<long, int>, std::pair<double, int>> by_hour;  // (day, hour) -> (degC, minute)
        std::size_t repeated = 0, untimed = 0;
        for (const auto& row : rows) {
            const auto t = row.temperature ? row.temperature : row.mean;
            if (!t) continue;
            if (row.hour < 0) {
                ++untimed;
                continue;
            }
            if (!by_hour.emplace(std::pair{row.day, row.hour}, std::pair{to_c(*t), row.minute}).second) ++repeated;
        }
        if (untimed > 0)
            throw input_error("/columns/time", "an hourly file needs the time of each reading; " + count_text(untimed, "row has", "rows have") +
                                                   " a date without a time (name the time column)");
        if (repeated > 0)
            series.notes.push_back(count_text(repeated, "extra reading", "extra readings") +
                                   " within an hour already read were left out (one reading an hour)");
        std::map<long, std::vector<double>> by_day;
        for (const auto& [when, reading] : by_hour) {
            by_day[when.first].push_back(reading.first);
            series.hourly_c.push_back(reading.first);
            series.hourly_day.push_back(when.first);
            series.hourly_clock.push_back(when.second + reading.second / 60.0);
        }
        std::size_t short_days = 0;
        for (const auto& [day, hours] : by_day) {
            if (hours.size() < 18) {
                ++short_days;
                continue;
            }
            double sum = 0;
            for (double t : hours) sum += t;
            const auto [lo, hi] = std::minmax_element(hours.begin(), hours.end());
            series.days.push_back({day, sum / static_cast<double>(hours.size()), *hi - *lo});
        }
        if (short_days > 0)
            series.warnings.push_back({"/text", count_text(short_days, "day has", "days have") +
                                                    " fewer than 18 hourly readings and no daily mean"});
        series.notes.push_back("daily mean = the mean of the day's hourly readings");
    }
    if (series.days.empty()) throw input_error("/text", "no whole day could be read");
    return series;
}

std::optional<weather_climate> climate_of_weather(const weather_series& series, double base_c, double bin_width_k,
                                                  std::string& why_not) {
    std::array<std::vector<double>, 12> by_month;
    std::vector<double> ranges;
    weather_climate out;
    out.base_c = base_c;
    double hdd = 0;
    for (const auto& day : series.days) {
        by_month[static_cast<std::size_t>(month_of_day(day.day))].push_back(day.mean_c);
        if (day.range_k) ranges.push_back(*day.range_k);
        hdd += std::max(0.0, base_c - day.mean_c);
    }
    static const char* names[] = {"January", "February", "March", "April", "May", "June",
                                  "July", "August", "September", "October", "November", "December"};
    std::vector<std::string> thin;
    for (int m = 0; m < 12; ++m)
        if (by_month[m].size() < 20) thin.push_back(std::string(names[m]) + " (" + std::to_string(by_month[m].size()) + " days)");
    if (!thin.empty()) {
        why_not = "a climate needs at least 20 observed days of every calendar month; the file has too few in " + list_text(thin);
        return std::nullopt;
    }
    for (int m = 0; m < 12; ++m) {
        const auto& values = by_month[m];
        double sum = 0;
        for (double t : values) sum += t;
        const double mean = sum / static_cast<double>(values.size());
        double squares = 0;
        for (double t : values) squares += (t - mean) * (t - mean);
        out.monthly_mean_c[m] = mean;
        // The spread of the daily means about the month's mean over all the years observed (at least
        // 0.1 K, the smallest spread a climate takes).
        out.monthly_sd_k[m] = std::max(0.1, std::sqrt(squares / static_cast<double>(values.size())));
    }
    if (!ranges.empty()) {
        double sum = 0;
        for (double r : ranges) sum += r;
        out.daily_range_k = sum / static_cast<double>(ranges.size());
    }
    out.years = static_cast<double>(series.days.size()) / 365.25;
    out.annual_hdd_k_day = hdd * 365.0 / static_cast<double>(series.days.size());
    if (!series.hourly_c.empty()) {
        out.bin_width_k = bin_width_k;
        std::map<long, double> counts;
        // Bin k holds [k - 1/2, k + 1/2) x width.
        for (double t : series.hourly_c) counts[static_cast<long>(std::floor(t / bin_width_k + 0.5))] += 1;
        const double scale = 8760.0 / static_cast<double>(series.hourly_c.size());
        for (const auto& [index, count] : counts) out.bins.push_back({static_cast<double>(index) * bin_width_k, count * scale});
        // When each bin's hours fell: a reading at clock time c stands for the half hours either side of it,
        // c - 1/2 to c + 1/2 (at h:00 half in hour h - 1, half in hour h; at 13:51 39 minutes in 13-14 h and
        // 21 in 14-15 h), in the month of its day.
        std::map<long, bin_times> times;
        for (std::size_t i = 0; i < series.hourly_c.size(); ++i) {
            auto& bin = times[static_cast<long>(std::floor(series.hourly_c[i] / bin_width_k + 0.5))];
            const double start = series.hourly_clock[i] - 0.5;
            const double first = std::floor(start);
            const auto slot = [](double hour) { return static_cast<std::size_t>((static_cast<long>(hour) % 24 + 24) % 24); };
            bin.by_hour[slot(first)] += scale * (1 - (start - first));
            bin.by_hour[slot(first + 1)] += scale * (start - first);
            bin.by_month[static_cast<std::size_t>(month_of_day(series.hourly_day[i]))] += scale;
        }
        for (const auto& [index, bin] : times) out.bins_when.push_back(bin);
        out.design_99_c = hourly_quantile(series.hourly_c, 0.01);
        out.design_996_c = hourly_quantile(series.hourly_c, 0.004);
    }
    return out;
}

}  // namespace fw
