// armature._core: the thin pybind11 layer. It converts between Python
// objects and the kernel's JSON boundary and releases the GIL while
// designing; every engineering rule stays in C++.
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <atomic>
#include <cmath>
#include <exception>
#include <thread>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/registry.hpp"
#include "armature/report.hpp"

namespace py = pybind11;
using nlohmann::json;

namespace {

json to_json(const py::handle& obj, const std::string& path, int depth = 0) {
  const std::string where = path.empty() ? "(request)" : path;
  if (depth > 64) throw armature::InputError({{where, "nested too deeply"}});
  if (obj.is_none()) return nullptr;
  if (py::isinstance<py::bool_>(obj)) return obj.cast<bool>();
  if (py::isinstance<py::str>(obj)) {
    try {
      return obj.cast<std::string>();
    } catch (const std::exception&) {
      throw armature::InputError({{where, "is not valid UTF-8 text"}});
    }
  }
  if (py::isinstance<py::dict>(obj)) {
    json j = json::object();
    for (auto item : py::reinterpret_borrow<py::dict>(obj)) {
      if (!py::isinstance<py::str>(item.first))
        throw armature::InputError({{where, "keys must be strings"}});
      std::string key = item.first.cast<std::string>();
      j[key] = to_json(item.second, path.empty() ? key : path + "." + key, depth + 1);
    }
    return j;
  }
  if (py::isinstance<py::list>(obj) || py::isinstance<py::tuple>(obj)) {
    json j = json::array();
    std::size_t i = 0;
    for (auto item : obj) {
      j.push_back(to_json(item, where + "[" + std::to_string(i) + "]", depth + 1));
      ++i;
    }
    return j;
  }
  if (py::isinstance<py::int_>(obj) || py::hasattr(obj, "__index__")) {
    try {
      return py::int_(py::reinterpret_borrow<py::object>(obj)).cast<long long>();
    } catch (const std::exception&) {
      throw armature::InputError({{where, "integer out of range"}});
    }
  }
  if (py::isinstance<py::float_>(obj) || py::hasattr(obj, "__float__"))
    return py::float_(py::reinterpret_borrow<py::object>(obj)).cast<double>();
  throw armature::InputError(
      {{where, "cannot be given as a Python " + std::string(py::str(obj.get_type().attr("__name__")))}});
}

py::object to_python(const json& j) {
  switch (j.type()) {
    case json::value_t::null: return py::none();
    case json::value_t::boolean: return py::bool_(j.get<bool>());
    case json::value_t::number_integer: return py::int_(j.get<long long>());
    case json::value_t::number_unsigned: return py::int_(j.get<unsigned long long>());
    case json::value_t::number_float: return py::float_(j.get<double>());
    case json::value_t::string: return py::str(j.get_ref<const std::string&>());
    case json::value_t::array: {
      py::list l;
      for (const auto& v : j) l.append(to_python(v));
      return l;
    }
    case json::value_t::object: {
      py::dict d;
      for (auto it = j.begin(); it != j.end(); ++it) d[py::str(it.key())] = to_python(it.value());
      return d;
    }
    default: return py::none();
  }
}

json design_json(const json& request) {
  return armature::result_to_json(armature::design(armature::Registry::shared(), request));
}

py::object design(const py::handle& request) {
  json req = to_json(request, "");
  json result;
  {
    py::gil_scoped_release release;
    result = design_json(req);
  }
  return to_python(result);
}

py::list design_many(const py::sequence& requests, unsigned threads) {
  std::vector<json> reqs;
  reqs.reserve(py::len(requests));
  for (std::size_t i = 0; i < py::len(requests); ++i) {
    try {
      reqs.push_back(to_json(requests[i], ""));
    } catch (const armature::InputError& e) {
      std::vector<armature::InputProblem> ps;
      for (auto p : e.problems()) ps.push_back({"requests[" + std::to_string(i) + "] " + p.field, p.message});
      throw armature::InputError(ps);
    }
  }
  std::vector<json> results(reqs.size());
  std::vector<std::exception_ptr> errors(reqs.size());
  {
    py::gil_scoped_release release;
    armature::Registry::shared();  // load plug-ins once, before the workers start
    unsigned n = threads ? threads : std::max(1u, std::thread::hardware_concurrency());
    n = static_cast<unsigned>(std::min<std::size_t>(n, std::max<std::size_t>(reqs.size(), 1)));
    std::atomic<std::size_t> next{0};
    auto work = [&] {
      for (std::size_t i; (i = next.fetch_add(1)) < reqs.size();) {
        try {
          results[i] = design_json(reqs[i]);
        } catch (...) {
          errors[i] = std::current_exception();
        }
      }
    };
    std::vector<std::thread> pool;
    for (unsigned t = 1; t < n; ++t) pool.emplace_back(work);
    work();
    for (auto& t : pool) t.join();
  }
  for (std::size_t i = 0; i < errors.size(); ++i) {
    if (!errors[i]) continue;
    try {
      std::rethrow_exception(errors[i]);
    } catch (const armature::InputError& e) {
      std::vector<armature::InputProblem> ps;
      for (auto p : e.problems()) ps.push_back({"requests[" + std::to_string(i) + "] " + p.field, p.message});
      throw armature::InputError(ps);
    }
  }
  py::list out;
  for (const auto& r : results) out.append(to_python(r));
  return out;
}

// Designs `request` again and writes its calculation record to `path`; the
// result given must be the one this request produces.
std::string write_record(const py::handle& request, const std::string& path, const py::handle& result) {
  json req = to_json(request, "");
  json given = to_json(result, "");
  const auto format = armature::record_format_for(path);
  {
    py::gil_scoped_release release;
    const auto record = armature::design(armature::Registry::shared(), req);
    if (armature::result_to_json(record) != given)
      throw std::invalid_argument("the result does not match its request (was it changed after design?)");
    armature::write_file_atomically(path, armature::calculation_record(record, req, format,
                                                                       armature::today_iso()));
  }
  return path;
}

py::list codes() {
  py::list out;
  for (const auto& c : armature::Registry::shared().codes()) {
    py::dict d;
    d["id"] = c.id;
    d["title"] = c.title;
    d["variants"] = c.variants;
    d["path"] = c.path;
    out.append(d);
  }
  return out;
}

py::list plugin_failures() {
  py::list out;
  for (const auto& f : armature::Registry::shared().failures()) {
    py::dict d;
    d["path"] = f.path;
    d["reason"] = f.reason;
    out.append(d);
  }
  return out;
}

}  // namespace

PYBIND11_MODULE(_core, m) {
  m.doc() = "armature design kernel (C++ core)";
  py::register_exception<armature::InputError>(m, "InputError", PyExc_ValueError);
  py::register_exception<armature::DesignError>(m, "DesignError", PyExc_RuntimeError);
  m.def("design", &design, py::arg("request"),
        "Design one slab strip from a request dict; returns the result dict.");
  m.def("design_many", &design_many, py::arg("requests"), py::arg("threads") = 0,
        "Design many requests on `threads` threads (0: all cores), GIL released.");
  m.def("write_record", &write_record, py::arg("request"), py::arg("path"), py::arg("result"),
        "Write the calculation record (.html or .md) of a request whose result is given.");
  m.def("codes", &codes, "The loaded code plug-ins: id, title, variants, path.");
  m.def("plugin_failures", &plugin_failures, "Plug-ins that failed to load, with the reason.");
  m.attr("__version__") = armature::version_string();
  m.attr("CAUTION") = armature::caution_text;
}
