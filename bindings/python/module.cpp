// armature._core: the thin pybind11 layer. It converts between Python
// objects and the kernel's JSON boundary and releases the GIL while
// designing; every engineering rule stays in C++.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <algorithm>
#include <cstdint>
#include <atomic>
#include <condition_variable>
#include <mutex>
#include <optional>
#include <cmath>
#include <exception>
#include <thread>
#include <unordered_map>

#include "armature/design.hpp"
#include "armature/json_io.hpp"
#include "armature/quantities.hpp"
#include "armature/registry.hpp"
#include "armature/report.hpp"
#include "armature/result_writer.hpp"
#include "armature/studies.hpp"

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
  // Floats first, without asking for attributes: a failed attribute lookup
  // raises and clears an exception, which costs more than the design.
  if (PyFloat_Check(obj.ptr())) return PyFloat_AS_DOUBLE(obj.ptr());
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

// Result objects repeat the same few dozen keys; their Python strings are
// made once (with their hash) and reused. Called with the GIL held.
// Values repeat too (check ids, clauses, units, places): short strings are
// cached as well, up to a bound, and shared (Python strings are immutable).
const py::object& key_object(const std::string& key) {
  static auto* cache = new std::unordered_map<std::string, py::object>();  // lives with the process
  auto it = cache->find(key);
  if (it == cache->end()) {
    if (cache->size() > 8192) cache->clear();
    py::str k(key);
    PyUnicode_InternInPlace(&k.ptr());
    it = cache->emplace(key, std::move(k)).first;
  }
  return it->second;
}

// The Python class of results (armature.Result, a dict that keeps its
// request), registered by the package at import; plain dicts until then.
PyObject* result_type = nullptr;

void set_result_type(const py::object& type) {
  Py_XDECREF(result_type);
  result_type = type.inc_ref().ptr();
}

// Builds the result's Python objects straight from the design record,
// through the shared schema of result_writer.hpp. Needs the GIL.
class PyWriter {
 public:
  void begin_object() {
    open(stack_.empty() && result_type ? new_result() : PyDict_New());
  }
  void begin_array() { open(PyList_New(0)); }
  void end() {
    last_closed_ = stack_.back();
    stack_.pop_back();
  }
  // The top-level list of checks holds the very dicts of the regions,
  // supports and spans ("the same objects as inside them").
  bool reuse(const armature::Check* c) {
    auto it = made_.find(c);
    if (it == made_.end()) return false;
    Py_INCREF(it->second);
    put(it->second);
    return true;
  }
  void remember(const armature::Check* c) { made_[c] = last_closed_; }
  void key(const char* k) {
    key_ = k;
    text_key_.reset();
  }
  // A key that is not a literal (an action's name): not cached.
  void key_text(const std::string& k) {
    key_ = "";
    text_key_ = py::str(k);
  }
  void value(double v) { put(PyFloat_FromDouble(v)); }
  void value(long long v) { put(PyLong_FromLongLong(v)); }
  void value(bool v) { put(PyBool_FromLong(v)); }
  void value(const std::string& v) {
    if (v.size() <= 64) put(key_object(v).inc_ref().ptr());
    else put(PyUnicode_FromStringAndSize(v.data(), static_cast<Py_ssize_t>(v.size())));
  }
  void value(const char* v) { value(std::string(v)); }
  // A label's text is stored once for the process: its Python string is
  // made once too, found by address.
  void value(const armature::Label& v) {
    static auto* cache = new std::unordered_map<const std::string*, py::object>();  // lives with the process
    auto it = cache->find(&v.str());
    if (it == cache->end()) it = cache->emplace(&v.str(), key_object(v.str())).first;
    put(it->second.inc_ref().ptr());
  }
  py::object take() { return std::move(root_); }

 private:
  // Steals `v`; returns it (borrowed) for opening.
  PyObject* put(PyObject* v) {
    if (!v) throw py::error_already_set();
    if (stack_.empty()) {
      root_ = py::reinterpret_steal<py::object>(v);
      return v;
    }
    PyObject* top = stack_.back();
    if (PyList_Check(top)) PyList_Append(top, v);
    else if (text_key_) PyDict_SetItem(top, text_key_->ptr(), v);
    else PyDict_SetItem(top, literal_key(key_), v);
    Py_DECREF(v);  // the container holds it now
    return v;
  }
  void open(PyObject* v) { stack_.push_back(put(v)); }
  static PyObject* literal_key(const char* key);
  // An empty armature.Result, made by its type's tp_new (its __init__,
  // Python code, is not needed: the caller sets `request`).
  static PyObject* new_result() {
    auto* type = reinterpret_cast<PyTypeObject*>(result_type);
    py::tuple no_args;
    return type->tp_new(type, no_args.ptr(), nullptr);
  }

  py::object root_;
  std::vector<PyObject*> stack_;
  PyObject* last_closed_ = nullptr;                           // borrowed
  std::unordered_map<const armature::Check*, PyObject*> made_;  // borrowed, owned by root_
  const char* key_ = "";
  std::optional<py::str> text_key_;
};

// Keys are string literals of result_writer.hpp: cached by address.
// Called with the GIL held, about two hundred times per result: a small
// direct-mapped table by address answers before the map.
PyObject* PyWriter::literal_key(const char* key) {
  struct Slot {
    const char* key = nullptr;
    PyObject* value = nullptr;
  };
  static Slot recent[256];
  Slot& slot = recent[(reinterpret_cast<std::uintptr_t>(key) * 0x9E3779B97F4A7C15ull) >> 56];
  if (slot.key == key) return slot.value;
  static auto* cache = new std::unordered_map<const char*, PyObject*>();  // lives with the process
  auto it = cache->find(key);
  if (it == cache->end()) {
    PyObject* k = PyUnicode_InternFromString(key);
    if (!k) throw py::error_already_set();
    it = cache->emplace(key, k).first;
  }
  slot = {key, it->second};
  return it->second;
}

// Result objects are many small containers without cycles: the cyclic
// collector is paused while they are built (it would otherwise run every
// few results and walk all the results made so far) and resumed after.
class CollectorPause {
 public:
  CollectorPause() : was_enabled_(PyGC_Disable()) {}
  ~CollectorPause() {
    if (was_enabled_) PyGC_Enable();
  }
  CollectorPause(const CollectorPause&) = delete;
  CollectorPause& operator=(const CollectorPause&) = delete;

 private:
  int was_enabled_;
};

// The result of one request, as an armature.Result that keeps the request.
py::object record_to_python(const armature::DesignRecord& record, const py::handle& request) {
  PyWriter w;
  armature::write_result(w, record);
  py::object result = w.take();
  if (result_type && PyObject_SetAttrString(result.ptr(), "request", request.ptr()) != 0)
    throw py::error_already_set();
  return result;
}

armature::DesignRecord design_record(const json& request) {
  return armature::design(armature::Registry::shared(), request);
}

py::object design(const py::handle& request) {
  json req = to_json(request, "");
  armature::DesignRecord record;
  {
    py::gil_scoped_release release;
    record = design_record(req);
  }
  CollectorPause pause;
  return record_to_python(record, request);
}

armature::InputError indexed(const armature::InputError& e, const std::string& prefix) {
  std::vector<armature::InputProblem> ps;
  for (const auto& p : e.problems()) ps.push_back({prefix + " " + p.field, p.message});
  return armature::InputError(ps);
}

// With one thread everything runs on the calling thread. With T threads,
// T − 1 workers design while the calling thread does what needs the GIL —
// converting requests from Python ahead of the workers and results back to
// Python in order — and designs too whenever it would otherwise wait.
// Everything stays within `window` items of the conversion, so memory is
// bounded however many requests there are.
py::list design_many(const py::sequence& requests, unsigned threads) {
  const std::size_t n = py::len(requests);
  const unsigned total = threads ? threads : std::max(1u, std::thread::hardware_concurrency());
  const std::size_t window = 256;
  std::vector<json> reqs(n);
  auto prepare = [&](std::size_t i) {  // needs the GIL
    try {
      reqs[i] = to_json(requests[i], "");
    } catch (const armature::InputError& e) {
      throw indexed(e, "requests[" + std::to_string(i) + "]");
    }
  };
  auto raise_for = [&](std::size_t i, std::exception_ptr error) {
    try {
      std::rethrow_exception(error);
    } catch (const armature::InputError& e) {
      throw indexed(e, "requests[" + std::to_string(i) + "]");
    }
  };
  py::list out;
  CollectorPause pause;
  if (total <= 1 || n <= 1) {
    armature::Registry::shared();
    for (std::size_t i = 0; i < n; ++i) {
      prepare(i);
      armature::DesignRecord record;
      std::exception_ptr error;
      {
        py::gil_scoped_release release;
        try {
          record = design_record(reqs[i]);
        } catch (...) {
          error = std::current_exception();
        }
      }
      if (error) raise_for(i, error);
      out.append(record_to_python(record, requests[i]));
      reqs[i] = json();
    }
    return out;
  }
  std::vector<armature::DesignRecord> results(n);
  std::vector<std::exception_ptr> errors(n);
  std::vector<char> ready(n, 0);
  std::mutex mutex;
  std::condition_variable ready_cv, work_cv;
  bool stop = false;                 // guarded by mutex
  std::size_t prepared = 0;          // requests converted so far; guarded by mutex
  std::size_t next = 0;              // next request to design; guarded by mutex
  // Claims up to `most` prepared requests from `next` on: the range
  // [first, end), empty when there is none now.
  struct Range {
    std::size_t first, end;
  };
  auto claim = [&](std::unique_lock<std::mutex>&, std::size_t most) {
    const Range r{next, std::min(prepared, next + most)};
    next = r.end;
    return r;
  };
  // Designs a claimed range, then marks it ready with one lock and one
  // wake-up (a hand-off per request cost more than the design itself).
  auto design_range = [&](Range r) {
    for (std::size_t i = r.first; i < r.end; ++i) {
      // The calling thread has converted every result more than `window`
      // behind this one (it cannot be claimed earlier): free one here, off
      // the calling thread.
      if (i > window) results[i - window - 1] = armature::DesignRecord{};
      try {
        results[i] = design_record(reqs[i]);
      } catch (...) {
        errors[i] = std::current_exception();
      }
    }
    {
      std::lock_guard<std::mutex> lock(mutex);
      for (std::size_t i = r.first; i < r.end; ++i) ready[i] = 1;
    }
    ready_cv.notify_one();
  };
  constexpr std::size_t worker_chunk = 8;  // requests a worker designs per hand-off
  std::vector<std::thread> pool;
  {
    py::gil_scoped_release release;
    armature::Registry::shared();  // load plug-ins once, before the workers start
    for (unsigned k = 1; k < total && k < n; ++k)
      pool.emplace_back([&] {
        for (;;) {
          Range r;
          {
            std::unique_lock<std::mutex> lock(mutex);
            work_cv.wait(lock, [&] { return stop || next < prepared || next >= n; });
            if (stop || next >= n) return;
            r = claim(lock, worker_chunk);
          }
          design_range(r);
        }
      });
  }
  auto join_all = [&] {
    py::gil_scoped_release release;
    {
      std::lock_guard<std::mutex> lock(mutex);
      stop = true;
    }
    work_cv.notify_all();
    for (auto& t : pool) t.join();
  };
  try {
    std::size_t converted_requests = 0;
    for (std::size_t i = 0; i < n; ++i) {
      // Keep the workers fed: requests up to `window` ahead of the results,
      // converted in batches so that the workers are woken seldom.
      const std::size_t target = std::min(n, i + window);
      if (converted_requests < std::min(n, i + window / 2 + 1)) {
        for (; converted_requests < target; ++converted_requests) prepare(converted_requests);
        {
          std::lock_guard<std::mutex> lock(mutex);
          prepared = converted_requests;
        }
        work_cv.notify_all();
      }
      {
        py::gil_scoped_release release;
        for (;;) {
          Range r;
          {
            std::unique_lock<std::mutex> lock(mutex);
            if (ready[i]) break;
            r = claim(lock, 1);  // one at a time: results are waiting to be converted
            if (r.first == r.end) {
              ready_cv.wait(lock, [&] { return ready[i] != 0; });
              break;
            }
          }
          design_range(r);
        }
      }
      if (errors[i]) raise_for(i, errors[i]);
      out.append(record_to_python(results[i], requests[i]));
      reqs[i] = json();
    }
  } catch (...) {
    join_all();
    throw;
  }
  join_all();
  return out;
}

// The axes of a study from Python: paths and lists of values.
std::vector<armature::StudyAxis> study_axes(const std::vector<std::string>& paths,
                                            const std::vector<py::list>& values) {
  std::vector<armature::StudyAxis> axes;
  for (std::size_t a = 0; a < values.size(); ++a) {
    armature::StudyAxis axis{paths.at(a), {}};
    for (std::size_t k = 0; k < py::len(values[a]); ++k)
      axis.values.push_back(to_json(values[a][k], paths[a] + "[" + std::to_string(k) + "]"));
    axes.push_back(std::move(axis));
  }
  return axes;
}

// A row's status: pass, fail, invalid (not a valid request), pruned (not designed).
const char* status_of(const armature::StudyRow& r) { return !r.designed ? "invalid" : r.pass ? "pass" : "fail"; }
const char* status_of(const armature::OptimiseRow& r) {
  return r.pruned ? "pruned" : status_of(static_cast<const armature::StudyRow&>(r));
}

// The columns of a study's rows: each axis's values, then `status` and the
// summary, then per region its bar, spacing and area, then `error`; `extra`
// adds columns after the status (the optimiser's). Needs the GIL.
template <class Row, class Extra>
py::dict study_columns(const armature::Study& study, const std::vector<py::list>& values,
                       const std::vector<Row>& rows, Extra&& extra) {
  const std::size_t total = rows.size();
  py::dict cols;
  for (std::size_t a = 0; a < study.axes().size(); ++a) {
    py::list col(total);
    for (std::size_t i = 0; i < total; ++i)
      PyList_SET_ITEM(col.ptr(), static_cast<py::ssize_t>(i),
                      py::object(values[a][study.value_index(i, a)]).release().ptr());
    cols[py::str(study.axes()[a].path)] = col;
  }
  auto numeric = [&](auto&& get) {
    py::array_t<double> arr(static_cast<py::ssize_t>(total));
    auto m = arr.mutable_unchecked<1>();
    for (std::size_t i = 0; i < total; ++i) m(static_cast<py::ssize_t>(i)) = get(rows[i]);
    return arr;
  };
  auto text = [&](auto&& get) {  // repeated labels share one string object
    py::list l(total);
    for (std::size_t i = 0; i < total; ++i)
      PyList_SET_ITEM(l.ptr(), static_cast<py::ssize_t>(i), key_object(get(rows[i])).inc_ref().ptr());
    return l;
  };
  cols["status"] = text([](const Row& r) { return std::string(status_of(r)); });
  extra(cols, numeric);
  cols["max_utilisation"] = numeric([](const Row& r) { return r.max_utilisation; });
  cols["governing_check"] = text([](const Row& r) { return r.governing_check; });
  cols["governing_where"] = text([](const Row& r) { return r.governing_where; });
  cols["steel_kg_m2"] = numeric([](const Row& r) { return r.steel_kg_m2; });
  cols["concrete_m3_m2"] = numeric([](const Row& r) { return r.concrete_m3_m2; });
  std::vector<std::string> wheres;
  bool any_given = false;  // check mode somewhere in the study: say which regions were given
  for (const auto& row : rows)
    for (const auto& g : row.regions) {
      if (std::find(wheres.begin(), wheres.end(), g.where) == wheres.end()) wheres.push_back(g.where);
      any_given = any_given || g.bars_given;
    }
  for (const auto& w : wheres) {
    auto find = [&](const Row& r) -> const armature::StudyRegion* {
      for (const auto& g : r.regions)
        if (g.where == w) return &g;
      return nullptr;
    };
    py::list bar;
    for (const auto& row : rows) {
      const auto* g = find(row);
      bar.append(g ? key_object(g->bar) : py::object(py::none()));
    }
    cols[py::str(w + " bar")] = bar;
    cols[py::str(w + " spacing_mm")] = numeric([&](const Row& r) {
      const auto* g = find(r);
      return g ? g->spacing_mm : NAN;
    });
    cols[py::str(w + " As_prov_mm2")] = numeric([&](const Row& r) {
      const auto* g = find(r);
      return g ? g->As_prov_mm2 : NAN;
    });
    if (any_given) {
      py::list given;
      for (const auto& row : rows) {
        const auto* g = find(row);
        given.append(g ? py::object(py::bool_(g->bars_given)) : py::object(py::none()));
      }
      cols[py::str(w + " bars_given")] = given;
    }
  }
  cols["error"] = text([](const Row& r) { return r.error; });
  return cols;
}

// A sweep over the product of the axes (the first axis varies slowest),
// designed by the kernel on all cores, returned column by column.
py::dict sweep_columns(const py::handle& base, const std::vector<std::string>& paths,
                       const std::vector<py::list>& values, unsigned threads) {
  const armature::Study study(to_json(base, ""), study_axes(paths, values));
  std::vector<armature::StudyRow> rows;
  {
    py::gil_scoped_release release;
    rows = armature::sweep(armature::Registry::shared(), study, threads);
  }
  CollectorPause pause;
  return study_columns(study, values, rows, [](py::dict&, auto&&) {});
}

// The optimiser's search of the product of the axes: the columns of every
// candidate (with objective, pruned, Pareto front and choice) and the choice.
py::dict optimise_columns(const py::handle& base, const std::vector<std::string>& paths,
                          const std::vector<py::list>& values, const std::string& objective,
                          const py::handle& rates, unsigned threads, bool prune) {
  const armature::Study study(to_json(base, ""), study_axes(paths, values));
  const json rates_json = to_json(rates, "rates");
  armature::Optimisation found;
  {
    py::gil_scoped_release release;
    found = armature::optimise(armature::Registry::shared(), study, objective, rates_json, threads, prune);
  }
  CollectorPause pause;
  const std::size_t chosen = found.chosen;
  py::dict cols = study_columns(study, values, found.rows, [&](py::dict& c, auto&& numeric) {
    using Row = armature::OptimiseRow;
    c["objective"] = numeric([](const Row& r) { return r.objective; });
    c["thickness_mm"] = numeric([](const Row& r) { return r.thickness_mm; });
    py::list pareto, picked;
    for (std::size_t i = 0; i < found.rows.size(); ++i) {
      pareto.append(py::bool_(found.rows[i].pareto));
      picked.append(py::bool_(i == chosen));
    }
    c["pareto"] = pareto;
    c["chosen"] = picked;
  });
  py::dict out;
  out["columns"] = cols;
  out["chosen"] = chosen;
  out["chosen_passes"] = found.chosen_passes;
  out["message"] = found.message;
  out["designed"] = found.designed;
  out["pruned"] = found.pruned;
  out["invalid"] = found.invalid;
  out["unit"] = armature::objective_unit(found.objective);
  return out;
}

// The structural problems of a request (types, required and unknown
// fields, generic ranges) as (field, message) pairs, without designing: the
// package checks sweep axes and overrides against the kernel's own fields.
py::list request_problems(const py::handle& request) {
  const json req = to_json(request, "");
  armature::InputProblems problems;
  armature::request_from_json(req, problems);
  py::list out;
  for (const auto& p : problems.items()) out.append(py::make_tuple(p.field, p.message));
  return out;
}

// The strip width a request gives (slab.strip_width_mm or its quantity
// form "strip_width"), in mm; None where it leaves the width to the code.
py::object given_strip_width_mm(const py::handle& request) {
  const json req = to_json(request, "");
  if (!armature::request_gives(req, "slab.strip_width_mm")) return py::none();
  armature::InputProblems problems;
  const armature::Request r = armature::request_from_json(req, problems);
  return py::float_(r.slab.strip_width_mm);
}

// The M and V envelopes of a request, per span, in kN and m.
py::list envelope_diagrams(const py::handle& request) {
  json req = to_json(request, "");
  armature::DesignRecord rec;
  {
    py::gil_scoped_release release;
    rec = armature::design(armature::Registry::shared(), req, armature::Detail::steps);
  }
  py::list spans;
  for (const auto& span : rec.diagrams) {
    std::vector<double> x, mmax, mmin, vmax, vmin;
    for (const auto& p : span) {
      x.push_back(p.x_mm * 1e-3);
      mmax.push_back(p.M_max * 1e-6);
      mmin.push_back(p.M_min * 1e-6);
      vmax.push_back(p.V_max * 1e-3);
      vmin.push_back(p.V_min * 1e-3);
    }
    py::dict d;
    d["x_m"] = x;
    d["M_max_kNm"] = mmax;
    d["M_min_kNm"] = mmin;
    d["V_max_kN"] = vmax;
    d["V_min_kN"] = vmin;
    spans.append(d);
  }
  return spans;
}

// Designs `request` again and writes its calculation record to `path`; the
// result given must be the one this request produces.
std::string write_record(const py::handle& request, const std::string& path, const py::handle& result) {
  json req = to_json(request, "");
  json given = to_json(result, "");
  const auto format = armature::record_format_for(path);
  {
    py::gil_scoped_release release;
    const auto record = armature::design(armature::Registry::shared(), req, armature::Detail::steps);
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
  m.def("_set_result_type", &set_result_type, py::arg("type"),
        "The class of results (set by the armature package).");
  m.def("design", &design, py::arg("request"),
        "Design one slab strip from a request dict; returns the result dict.");
  m.def("design_many", &design_many, py::arg("requests"), py::arg("threads") = 0,
        "Design many requests on `threads` threads (0: all cores), GIL released.");
  m.def("write_record", &write_record, py::arg("request"), py::arg("path"), py::arg("result"),
        "Write the calculation record (.html or .md) of a request whose result is given.");
  m.def("sweep_columns", &sweep_columns, py::arg("base"), py::arg("paths"), py::arg("values"),
        py::arg("threads") = 0, "Design the product of the axes; columns of the results.");
  m.def("optimise_columns", &optimise_columns, py::arg("base"), py::arg("paths"), py::arg("values"),
        py::arg("objective"), py::arg("rates"), py::arg("threads") = 0, py::arg("prune") = true,
        "Search the product of the axes for the best passing design under the objective.");
  m.def("request_problems", &request_problems, py::arg("request"),
        "Structural problems of a request as (field, message) pairs, without designing.");
  m.def("given_strip_width_mm", &given_strip_width_mm, py::arg("request"),
        "The strip width a request gives, in mm; None where the code's default applies.");
  m.def("envelope_diagrams", &envelope_diagrams, py::arg("request"),
        "M and V envelopes of a request along each span.");
  m.def("codes", &codes, "The loaded code plug-ins: id, title, variants, path.");
  m.def("plugin_failures", &plugin_failures, "Plug-ins that failed to load, with the reason.");
  m.attr("__version__") = armature::version_string();
  m.attr("CAUTION") = armature::caution_text;
}
