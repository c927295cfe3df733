#pragma once
// Reads the cited reference tables in tests/reference/*.csv (shared with pytest).
// Simple CSV: comma separated, fields may be double-quoted.
#include <fstream>
#include <map>
#include <stdexcept>
#include <string>
#include <vector>

namespace colligate_test {

using csv_row = std::map<std::string, std::string>;

/// The folder of tests/reference/ (defined in main.cpp, the one file compiled with it).
const char* reference_dir();

inline std::vector<std::string> split_csv_line(const std::string& line) {
  std::vector<std::string> out;
  std::string field;
  bool quoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char c = line[i];
    if (quoted) {
      if (c == '"' && i + 1 < line.size() && line[i + 1] == '"') {
        field.push_back('"');
        ++i;
      } else if (c == '"') {
        quoted = false;
      } else {
        field.push_back(c);
      }
    } else if (c == '"') {
      quoted = true;
    } else if (c == ',') {
      out.push_back(field);
      field.clear();
    } else if (c != '\r') {
      field.push_back(c);
    }
  }
  out.push_back(field);
  return out;
}

inline std::vector<csv_row> read_reference(const std::string& name) {
  const std::string path = std::string(reference_dir()) + "/" + name;
  std::ifstream in(path);
  if (!in) throw std::runtime_error("cannot open reference table " + path);
  std::string line;
  std::getline(in, line);
  const auto header = split_csv_line(line);
  std::vector<csv_row> rows;
  while (std::getline(in, line)) {
    if (line.empty()) continue;
    const auto fields = split_csv_line(line);
    csv_row row;
    for (std::size_t i = 0; i < header.size() && i < fields.size(); ++i) row[header[i]] = fields[i];
    rows.push_back(row);
  }
  return rows;
}

}  // namespace colligate_test
