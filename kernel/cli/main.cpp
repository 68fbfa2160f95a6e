// armature: command-line front end of the design kernel.
//   armature design FILE|- [--json] [--report out.html|out.md]
//                                     design one slab strip (and write its record)
//   armature codes                    list the code plug-ins and load failures
//   armature --version
//   armature --help | -h              usage and the caution, on stdout
// Exit codes: 0 every check passes, 1 some check fails, 2 bad input or
// usage (messages on stderr, nothing on stdout), 3 internal error.
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
#include "armature/report.hpp"
#include "armature/summary.hpp"

namespace {

constexpr int exit_pass = 0, exit_fail = 1, exit_input = 2, exit_internal = 3;
constexpr std::size_t max_request_bytes = 1 << 20;  // a slab request is a few hundred bytes

const char* usage =
    "usage: armature design FILE|- [--json] [--report RECORD.html|RECORD.md]\n"
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
               "                  also writes the calculation record (.html or .md)\n"
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

int design_command(const std::vector<std::string>& args) {
  std::string file, report;
  bool as_json = false;
  for (std::size_t i = 0; i < args.size(); ++i) {
    const std::string& a = args[i];
    if (a == "--help" || a == "-h") return help();
    if (a == "--json") as_json = true;
    else if (a == "--report") {
      if (i + 1 >= args.size()) return usage_error("--report needs a file name (.html or .md)");
      report = args[++i];
    } else if (a.size() > 1 && a[0] == '-' && a != "-") return usage_error("unknown option " + a);
    else if (file.empty()) file = a;
    else return usage_error("design takes one request file, got also " + a);
  }
  if (file.empty()) return usage_error("design needs a request file, or - for standard input");
  if (!report.empty()) {
    try {
      armature::record_format_for(report);
    } catch (const armature::InputError& e) {
      return usage_error(e.problems().front().message);
    }
    std::error_code ec;
    if (file != "-" && (std::filesystem::absolute(report) == std::filesystem::absolute(file) ||
                        std::filesystem::equivalent(report, file, ec)))
      return usage_error("--report would overwrite the request file " + file);
  }

  std::string text;
  if (file == "-") {
    text.assign(std::istreambuf_iterator<char>(std::cin), std::istreambuf_iterator<char>());
  } else {
    std::ifstream in(file, std::ios::binary);
    if (!in) {
      std::cerr << "armature: cannot read request file " << file << "\n";
      return exit_input;
    }
    text.assign(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
  }
  if (text.size() > max_request_bytes) {
    std::cerr << "armature: (request): larger than 1 MiB (" << text.size() << " bytes); a slab "
                 "request is a few hundred bytes\n";
    return exit_input;
  }
  nlohmann::json request;
  try {
    request = nlohmann::json::parse(text);
  } catch (const nlohmann::json::exception& e) {  // syntax, number overflow
    std::cerr << "armature: (request): not valid JSON: " << e.what() << "\n";
    return exit_input;
  }
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
  std::string out = as_json ? armature::result_to_json_text(record, 2) + "\n"
                            : armature::format_summary(record);
  std::cout << out << std::flush;
  return record.pass ? exit_pass : exit_fail;
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
    return usage_error("unknown command " + args[0]);
  } catch (const std::exception& e) {
    std::cerr << "armature: internal error: " << e.what() << "\n";
    return exit_internal;
  } catch (...) {
    std::cerr << "armature: internal error\n";
    return exit_internal;
  }
}
