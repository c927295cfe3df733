#pragma once
/// \file solute_table.hpp
/// A set of solute records with name resolution. Names are case-insensitive; spaces,
/// hyphens and underscores are interchangeable; the id, display name, formula and
/// aliases are all accepted. An unknown name throws invalid_input listing the nearest
/// known names.

#include <algorithm>
#include <cctype>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/data/solute_record.hpp"

namespace colligate::data {

namespace detail {

inline std::string normalise_name(const std::string& s) {
  std::string out;
  out.reserve(s.size());
  for (char c : s) {
    if (c == ' ' || c == '-' || c == '_') {
      if (!out.empty() && out.back() != '_') out.push_back('_');
    } else {
      out.push_back(static_cast<char>(std::tolower(static_cast<unsigned char>(c))));
    }
  }
  while (!out.empty() && out.back() == '_') out.pop_back();
  return out;
}

inline std::size_t edit_distance(const std::string& a, const std::string& b) {
  std::vector<std::size_t> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diag = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t up = row[j];
      row[j] = std::min({row[j] + 1, row[j - 1] + 1, diag + (a[i - 1] == b[j - 1] ? 0u : 1u)});
      diag = up;
    }
  }
  return row[b.size()];
}

}  // namespace detail

class solute_table {
 public:
  solute_table() = default;
  explicit solute_table(std::vector<solute_record> records) {
    for (auto& r : records) add(std::move(r));
  }

  /// Adds a record; throws if its id or any accepted name is already taken.
  void add(solute_record r) {
    if (r.id.empty()) throw invalid_input("solute_table::add: solute id must not be empty");
    if (!(r.molar_mass > 0.0))
      throw invalid_input(colligate::detail::describe(
          "solute_table::add", "molar_mass of '" + r.id + "'", r.molar_mass,
          "must be > 0 kg/mol"));
    if (r.particles < 1)
      throw invalid_input("solute_table::add: particles of '" + r.id + "' must be >= 1");
    if (!r.ions.empty()) {
      int charge = 0;
      for (const auto& i : r.ions) {
        if (i.count < 1 || i.charge == 0)
          throw invalid_input("solute_table::add: ion '" + i.ion + "' of '" + r.id +
                              "' needs a count >= 1 and a non-zero charge");
        charge += i.charge * i.count;
      }
      if (charge != 0)
        throw invalid_input("solute_table::add: the ions of '" + r.id + "' carry a net charge of " +
                            std::to_string(charge) + " per formula unit; a salt must be neutral (0)");
    }
    for (const auto& key : keys_of(r)) {
      for (const auto& existing : records_) {
        for (const auto& k2 : keys_of(existing)) {
          if (k2 == key)
            throw invalid_input("solute_table::add: name '" + key + "' of '" + r.id +
                                "' is already used by '" + existing.id + "'");
        }
      }
    }
    records_.push_back(std::move(r));
  }

  const std::vector<solute_record>& records() const noexcept { return records_; }
  std::size_t size() const noexcept { return records_.size(); }

  /// Returns the record for a name, or nullptr.
  const solute_record* try_find(const std::string& name) const {
    const std::string n = detail::normalise_name(name);
    for (const auto& r : records_)
      for (const auto& key : keys_of(r))
        if (key == n) return &r;
    const solute_record* by_formula = nullptr;
    for (const auto& r : records_) {
      if (!r.formula.empty() && detail::normalise_name(r.formula) == n) {
        if (by_formula) return nullptr;  // ambiguous formula: find() explains
        by_formula = &r;
      }
    }
    return by_formula;
  }

  /// Returns the record for a name; throws invalid_input with the nearest names.
  const solute_record& find(const std::string& name) const {
    if (const auto* r = try_find(name)) return *r;
    const std::string n = detail::normalise_name(name);
    std::string same_formula;
    for (const auto& r : records_)
      if (!r.formula.empty() && detail::normalise_name(r.formula) == n)
        same_formula += (same_formula.empty() ? "'" : ", '") + r.id + "'";
    if (!same_formula.empty())
      throw invalid_input("solute formula '" + name + "' is ambiguous: it matches " +
                          same_formula + "; give the name instead");
    throw invalid_input("unknown solute '" + name + "'; nearest known names: " +
                        nearest_names(name, 3) +
                        " (colligate.solutes() lists them all)");
  }

  /// Up to `count` known ids closest to `name`, comma separated.
  std::string nearest_names(const std::string& name, std::size_t count) const {
    const std::string n = detail::normalise_name(name);
    std::vector<std::pair<std::size_t, std::string>> scored;
    for (const auto& r : records_) {
      std::size_t best = static_cast<std::size_t>(-1);
      auto keys = keys_of(r);
      keys.push_back(detail::normalise_name(r.formula));
      for (const auto& key : keys) {
        std::size_t d = detail::edit_distance(n, key);
        if (!n.empty() && key.find(n) != std::string::npos) d = std::min<std::size_t>(d, 1);
        best = std::min(best, d);
      }
      scored.emplace_back(best, r.id);
    }
    std::stable_sort(scored.begin(), scored.end(),
                     [](const auto& a, const auto& b) { return a.first < b.first; });
    std::string out;
    for (std::size_t i = 0; i < scored.size() && i < count; ++i) {
      if (i) out += ", ";
      out += "'" + scored[i].second + "'";
    }
    return out;
  }

 private:
  static std::vector<std::string> keys_of(const solute_record& r) {
    // The formula is not a unique key (glucose and fructose share C6H12O6); try_find
    // accepts it only where it is unambiguous.
    std::vector<std::string> keys{detail::normalise_name(r.id), detail::normalise_name(r.name)};
    for (const auto& a : r.aliases) keys.push_back(detail::normalise_name(a));
    keys.erase(std::remove(keys.begin(), keys.end(), std::string()), keys.end());
    std::sort(keys.begin(), keys.end());
    keys.erase(std::unique(keys.begin(), keys.end()), keys.end());
    return keys;
  }

  std::vector<solute_record> records_;
};

}  // namespace colligate::data
