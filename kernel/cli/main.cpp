// armature: command-line front end of the design kernel.
//   armature design FILE|- [--json] [--report out.html|out.md]
//                                     design one slab strip (and write its record)
//   armature optimise FILE|- --vary PATH=VALUES... [--objective cost|carbon|depth|steel_mass]
//                    [--rates RATES.json] [--json] [--report out.html|out.md]
//                                     the best passing slab over the axes (and its record)
//   armature codes                    list the code plug-ins and load failures
//   armature --version
//   armature --help | -h              usage and the caution, on stdout
// Exit codes: 0 every check passes, 1 some check fails, 2 bad input or
// usage (messages on stderr, nothing on stdout), 3 internal error.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <iterator>
#include <sstream>
#include <string>
#include <vector>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "armature/format.hpp"
#include "armature/report.hpp"
#include "armature/studies.hpp"
#include "armature/summary.hpp"

namespace {

constexpr int exit_pass = 0, exit_fail = 1, exit_input = 2, exit_internal = 3;
constexpr std::size_t max_request_bytes = 1 << 20;  // a slab request is a few hundred bytes

const char* usage =
    "usage: armature design FILE|- [--json] [--report RECORD.html|RECORD.md]\n"
    "       armature optimise FILE|- --vary PATH=VALUES [--vary ...] [--objective OBJECTIVE]\n"
    "                [--rates RATES.json] [--json] [--report RECORD.html|RECORD.md]\n"
    "       armature codes\n"
    "       armature --version\n"
    "       armature --help\n";

// Usage and the caution on stdout: asking for help is not an error.
int help() {
  std::cout << "armature " << armature::version_string()
            << ": design of reinforced concrete one-way slab strips\n"
            << usage << "\n"
            << "  design FILE|-   design the request in FILE (- for standard input) and print\n"
               "                  its summary; --json prints the result JSON instead, --report\n"
               "                  also writes the calculation record (.html or .md), --schedule\n"
               "                  the bar schedule of a request with detailing (.csv)\n"
               "  optimise FILE|- search the product of the --vary axes for the passing slab of\n"
               "                  least objective (cost, the default; carbon; depth; steel_mass)\n"
               "                  with the rates of --rates (none is built in); prints the\n"
               "                  choice, then its summary, result JSON and record as design.\n"
               "                  VALUES: FIRST:LAST:STEP, a,b,c, or a JSON list\n"
               "  codes           list the code plug-ins, their variants and load failures\n\n"
               "Exit codes: 0 every check passes, 1 some check fails, 2 bad input or usage,\n"
               "3 internal error.\n\n"
            << "Caution: " << armature::caution_text << "\n";
  return exit_pass;
}

int usage_error(const std::string& message) {
  std::cerr << "armature: " << message << "\n" << usage;
  return exit_input;
}

int list_codes() {
  const auto& reg = armature::Registry::shared();
  std::cout << "Code plug-ins\n";
  if (reg.codes().empty()) std::cout << "  (none loaded)\n";
  for (const auto& c : reg.codes()) {
    std::cout << "  " << c.id << "  " << c.title << " [" << c.edition << "]\n";
    std::cout << "    variants: ";
    for (std::size_t i = 0; i < c.variants.size(); ++i)
      std::cout << (i ? ", " : "") << c.variants[i] << (c.variants[i] == c.default_variant ? " (default)" : "");
    std::cout << "\n    slab types: ";
    for (std::size_t i = 0; i < c.slab_types.size(); ++i) std::cout << (i ? ", " : "") << c.slab_types[i];
    std::cout << "\n    file: " << c.path << "\n";
  }
  if (!reg.failures().empty()) {
    std::cout << "Not loaded\n";
    for (const auto& f : reg.failures()) std::cout << "  " << f.path << ": " << f.reason << "\n";
  }
  std::cout << "Search path\n";
  for (const auto& d : reg.search_dirs()) std::cout << "  " << d.string() << "\n";
  return exit_pass;
}

// Reads a JSON document from FILE or standard input ("-"); false with the
// message printed (exit 2) when it cannot.
bool read_json(const std::string& file, const std::string& what, nlohmann::json& out) {
  std::string text;
  if (file == "-") {
    text.assign(std::istreambuf_iterator<char>(std::cin), std::istreambuf_iterator<char>());
  } else {
    std::ifstream in(file, std::ios::binary);
    if (!in) {
      std::cerr << "armature: cannot read " << what << " file " << file << "\n";
      return false;
    }
    text.assign(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
  }
  if (text.size() > max_request_bytes) {
    std::cerr << "armature: (" << what << "): larger than 1 MiB (" << text.size() << " bytes); a slab "
                 "request is a few hundred bytes\n";
    return false;
  }
  try {
    out = nlohmann::json::parse(text);
  } catch (const nlohmann::json::exception& e) {  // syntax, number overflow
    std::cerr << "armature: (" << what << "): not valid JSON: " << e.what() << "\n";
    return false;
  }
  return true;
}

// --report must name a record format and must not overwrite the request.
int check_report(const std::string& report, const std::string& file) {
  if (report.empty()) return exit_pass;
  try {
    armature::record_format_for(report);
  } catch (const armature::InputError& e) {
    return usage_error("--report: " + e.problems().front().message);
  }
  std::error_code ec;
  if (file != "-" && (std::filesystem::absolute(report) == std::filesystem::absolute(file) ||
                      std::filesystem::equivalent(report, file, ec)))
    return usage_error("--report would overwrite the request file " + file);
  return exit_pass;
}

// Designs the request and writes what `design` writes: the summary (or the
// result JSON) on stdout and the calculation record when asked. `before`
// is printed ahead of the summary (not with --json).
// --schedule: the bar schedule of a detailed design as CSV (mark, bar,
// count, length_mm, shape, mass_kg), the caution on its first line.
bool write_schedule(const armature::DesignRecord& record, const std::string& path) {
  if (!record.detailing) {
    std::cerr << "armature: --schedule: the request gives no detailing (add \"detailing\": {\"slab_width_m\": ...})\n";
    return false;
  }
  std::string csv = std::string("# ") + armature::caution_text + "\n";
  csv += "mark,bar,count,length_mm,shape,mass_kg\n";
  char buf[64];
  for (const auto& row : record.detailing->schedule) {
    std::snprintf(buf, sizeof buf, "%d,%.0f,", row.count, row.length_mm);
    csv += row.mark + "," + row.bar + "," + buf + row.shape + ",";
    std::snprintf(buf, sizeof buf, "%.3f\n", row.mass_kg);
    csv += buf;
  }
  try {
    armature::write_file_atomically(path, csv);
  } catch (const std::exception& e) {
    std::cerr << "armature: cannot write the schedule: " << e.what() << "\n";
    return false;
  }
  return true;
}

int design_and_write(const nlohmann::json& request, const std::string& report, bool as_json,
                     const std::string& before = "", const std::string& schedule = "") {
  armature::DesignRecord record;
  try {
    record = armature::design(armature::Registry::shared(), request,
                              report.empty() ? armature::Detail::checks : armature::Detail::steps);
  } catch (const armature::InputError& e) {
    for (const auto& p : e.problems()) std::cerr << "armature: " << p.text() << "\n";
    return exit_input;
  } catch (const armature::DesignError& e) {
    std::cerr << "armature: design error: " << e.what() << "\n";
    return exit_internal;
  }
  if (!report.empty()) {
    try {
      armature::write_file_atomically(
          report, armature::calculation_record(record, request, armature::record_format_for(report),
                                               armature::today_iso()));
    } catch (const std::exception& e) {
      std::cerr << "armature: cannot write the calculation record: " << e.what() << "\n";
      return exit_internal;
    }
  }
  if (!schedule.empty() && !write_schedule(record, schedule)) return exit_input;
  std::string out = as_json ? armature::result_to_json_text(record, 2) + "\n"
                            : before + armature::format_summary(record);
  std::cout << out << std::flush;
  return record.pass ? exit_pass : exit_fail;
}

int design_command(const std::vector<std::string>& args) {
  std::string file, report, schedule;
  bool as_json = false;
  for (std::size_t i = 0; i < args.size(); ++i) {
    const std::string& a = args[i];
    if (a == "--help" || a == "-h") return help();
    if (a == "--json") as_json = true;
    else if (a == "--report") {
      if (i + 1 >= args.size()) return usage_error("--report needs a file name (.html or .md)");
      report = args[++i];
    } else if (a == "--schedule") {
      if (i + 1 >= args.size()) return usage_error("--schedule needs a file name (.csv)");
      schedule = args[++i];
    } else if (a.size() > 1 && a[0] == '-' && a != "-") return usage_error("unknown option " + a);
    else if (file.empty()) file = a;
    else return usage_error("design takes one request file, got also " + a);
  }
  if (file.empty()) return usage_error("design needs a request file, or - for standard input");
  if (int bad = check_report(report, file)) return bad;
  if (!schedule.empty() && file != "-" && std::filesystem::exists(file) && std::filesystem::exists(schedule) &&
      std::filesystem::equivalent(schedule, file))
    return usage_error("--schedule would overwrite the request file " + file);
  nlohmann::json request;
  if (!read_json(file, "request", request)) return exit_input;
  return design_and_write(request, report, as_json, "", schedule);
}

constexpr std::size_t max_candidates = 1000000;

// A number written in an option, whole or not; false when `text` is not one.
bool option_number(const std::string& text, nlohmann::json& out) {
  if (text.empty()) return false;
  try {
    out = nlohmann::json::parse(text);
  } catch (const nlohmann::json::exception&) {
    return false;
  }
  return out.is_number();
}

// The values of --vary PATH=VALUES: FIRST:LAST:STEP (numbers, LAST
// included), a JSON list, or a comma-separated list (numbers as numbers,
// anything else as text). An empty string on success, else the problem.
std::string vary_values(const std::string& text, std::vector<nlohmann::json>& values) {
  if (text.empty()) return "give the values after =";
  if (text.front() == '[') {
    nlohmann::json list;
    try {
      list = nlohmann::json::parse(text);
    } catch (const nlohmann::json::exception&) {
      return "the values are not a valid JSON list";
    }
    if (!list.is_array() || list.empty()) return "the JSON list of values is empty";
    for (auto& v : list) values.push_back(v);
    return "";
  }
  if (text.find(',') == std::string::npos && std::count(text.begin(), text.end(), ':') == 2) {
    const auto c1 = text.find(':'), c2 = text.find(':', c1 + 1);
    nlohmann::json first, last, step;
    if (option_number(text.substr(0, c1), first) && option_number(text.substr(c1 + 1, c2 - c1 - 1), last) &&
        option_number(text.substr(c2 + 1), step)) {
      const double a = first.get<double>(), b = last.get<double>(), d = step.get<double>();
      if (!(d > 0.0)) return "the step of FIRST:LAST:STEP must be more than zero";
      if (b < a) return "LAST of FIRST:LAST:STEP is less than FIRST";
      const double count = std::floor((b - a) / d + 1e-9) + 1.0;
      if (count > static_cast<double>(max_candidates)) return "the range has more than a million values";
      const bool whole = first.is_number_integer() && step.is_number_integer();
      for (std::size_t k = 0; k < static_cast<std::size_t>(count); ++k) {
        if (whole) values.emplace_back(first.get<long long>() + static_cast<long long>(k) * step.get<long long>());
        else values.emplace_back(std::round((a + static_cast<double>(k) * d) * 1e9) / 1e9);
      }
      return "";
    }
  }
  std::size_t from = 0;
  for (;;) {
    const auto comma = text.find(',', from);
    const std::string item = text.substr(from, comma == std::string::npos ? std::string::npos : comma - from);
    if (item.empty()) return "an empty value in the comma-separated list";
    nlohmann::json number;
    if (option_number(item, number)) values.push_back(number);
    else values.emplace_back(item);
    if (comma == std::string::npos) break;
    from = comma + 1;
  }
  return "";
}

int optimise_command(const std::vector<std::string>& args) {
  std::string file, report, rates_file, objective = "cost";
  bool as_json = false;
  std::vector<armature::StudyAxis> axes;
  for (std::size_t i = 0; i < args.size(); ++i) {
    const std::string& a = args[i];
    auto value = [&]() -> const std::string* { return i + 1 < args.size() ? &args[++i] : nullptr; };
    if (a == "--help" || a == "-h") return help();
    if (a == "--json") as_json = true;
    else if (a == "--report") {
      const auto* v = value();
      if (!v) return usage_error("--report needs a file name (.html or .md)");
      report = *v;
    } else if (a == "--rates") {
      const auto* v = value();
      if (!v) return usage_error("--rates needs a JSON file of rates");
      rates_file = *v;
    } else if (a == "--objective") {
      const auto* v = value();
      if (!v) return usage_error("--objective needs one of cost, carbon, depth, steel_mass");
      objective = *v;
      if (objective != "cost" && objective != "carbon" && objective != "depth" && objective != "steel_mass")
        return usage_error("--objective must be one of cost, carbon, depth, steel_mass, got " + objective);
    } else if (a == "--vary") {
      const auto* v = value();
      if (!v) return usage_error("--vary needs PATH=VALUES, e.g. slab.thickness_mm=150:300:10");
      const auto eq = v->find('=');
      if (eq == std::string::npos || eq == 0)
        return usage_error("--vary " + *v + ": write PATH=VALUES, e.g. slab.thickness_mm=150:300:10");
      armature::StudyAxis axis{v->substr(0, eq), {}};
      const std::string problem = vary_values(v->substr(eq + 1), axis.values);
      if (!problem.empty()) return usage_error("--vary " + *v + ": " + problem);
      for (const auto& other : axes)
        if (other.path == axis.path) return usage_error("--vary " + axis.path + " is given twice");
      axes.push_back(std::move(axis));
    } else if (a.size() > 1 && a[0] == '-' && a != "-") return usage_error("unknown option " + a);
    else if (file.empty()) file = a;
    else return usage_error("optimise takes one request file, got also " + a);
  }
  if (file.empty()) return usage_error("optimise needs a request file, or - for standard input");
  if (axes.empty()) return usage_error("optimise needs at least one --vary PATH=VALUES");
  double candidates = 1.0;
  for (const auto& axis : axes) candidates *= static_cast<double>(axis.values.size());
  if (candidates > static_cast<double>(max_candidates))
    return usage_error("--vary: the axes make more than a million candidates");
  if (rates_file.empty() && (objective == "cost" || objective == "carbon"))
    return usage_error("--rates is needed for the " + objective + " objective (no rate is built in)");
  if (rates_file == "-" && file == "-") return usage_error("--rates and the request cannot both be standard input");
  if (int bad = check_report(report, file)) return bad;
  if (!rates_file.empty() && !report.empty() && rates_file != "-") {
    std::error_code ec;
    if (std::filesystem::equivalent(report, rates_file, ec))
      return usage_error("--report would overwrite the rates file " + rates_file);
  }
  nlohmann::json request, rates;
  if (!read_json(file, "request", request)) return exit_input;
  if (!rates_file.empty() && !read_json(rates_file, "rates", rates)) return exit_input;

  const armature::Study study(request, axes);
  armature::Optimisation found;
  try {
    found = armature::optimise(armature::Registry::shared(), study, objective, rates);
  } catch (const armature::InputError& e) {
    for (const auto& p : e.problems()) std::cerr << "armature: " << p.text() << "\n";
    return exit_input;
  }
  const auto& chosen = found.rows[found.chosen];
  const std::string unit = armature::objective_unit(found.objective);
  auto values_of = [&](std::size_t i) {
    std::string out;
    for (std::size_t a = 0; a < study.axes().size(); ++a)
      out += (a ? ", " : "") + study.axes()[a].path + "=" +
             [](const nlohmann::json& v) { return v.is_string() ? v.get<std::string>() : v.dump(); }(
                 study.axes()[a].values[study.value_index(i, a)]);
    return out;
  };
  std::string before = "Optimised  " + objective + " (" + unit + "): " + found.message + "\n";
  before += std::string(found.chosen_passes ? "Chosen     " : "Least-failing (FAIL) ") + values_of(found.chosen) +
            ": " + armature::plain_number(chosen.objective) + " " + unit + "\n";
  before += "Front      passing candidates no thinner one beats (thickness, objective):\n";
  std::vector<std::size_t> front;
  for (std::size_t i = 0; i < found.rows.size(); ++i)
    if (found.rows[i].pareto) front.push_back(i);
  std::sort(front.begin(), front.end(), [&](std::size_t x, std::size_t y) {
    return found.rows[x].thickness_mm < found.rows[y].thickness_mm;
  });
  if (front.empty()) before += "           (none passes)\n";
  for (std::size_t i : front)
    before += "           " + armature::plain_number(found.rows[i].thickness_mm) + " mm  " +
              armature::plain_number(found.rows[i].objective) + " " + unit + "  (" + values_of(i) + ")\n";
  before += "Caution    " + std::string(armature::caution_text) + "\n\n";
  return design_and_write(study.request(found.chosen), report, as_json, before);
}

}  // namespace

int main(int argc, char** argv) {
  try {
    std::vector<std::string> args(argv + 1, argv + argc);
    if (args.empty()) return usage_error("no command given");
    if (args[0] == "--version") {
      std::cout << "armature " << armature::version_string() << "\n";
      return exit_pass;
    }
    if (args[0] == "--help" || args[0] == "-h") return help();
    if (args[0] == "codes") {
      if (args.size() == 2 && (args[1] == "--help" || args[1] == "-h")) return help();
      if (args.size() > 1) return usage_error("codes takes no arguments");
      return list_codes();
    }
    if (args[0] == "design") return design_command({args.begin() + 1, args.end()});
    if (args[0] == "optimise") return optimise_command({args.begin() + 1, args.end()});
    return usage_error("unknown command " + args[0]);
  } catch (const std::exception& e) {
    std::cerr << "armature: internal error: " << e.what() << "\n";
    return exit_internal;
  } catch (...) {
    std::cerr << "armature: internal error\n";
    return exit_internal;
  }
}
