// The result of contract.md as nlohmann::json, through the shared schema of
// result_writer.hpp.
#include "armature/json_io.hpp"
#include "armature/result_writer.hpp"

namespace armature {

using nlohmann::json;

namespace {
// Builds a json value from the writer calls.
class JsonWriter {
 public:
  void begin_object() { open(json::object()); }
  void begin_array() { open(json::array()); }
  void end() { stack_.pop_back(); }
  void key(const char* k) { key_ = k; }
  void value(double v) { put(v); }
  void value(bool v) { put(v); }
  void value(const std::string& v) { put(v); }
  void value(const char* v) { put(std::string(v)); }
  json take() { return std::move(root_); }

 private:
  json* put(json v) {
    if (stack_.empty()) {
      root_ = std::move(v);
      return &root_;
    }
    json& top = *stack_.back();
    if (top.is_array()) {
      top.push_back(std::move(v));
      return &top.back();
    }
    json& slot = top[key_];
    slot = std::move(v);
    return &slot;
  }
  void open(json v) { stack_.push_back(put(std::move(v))); }

  json root_;
  std::vector<json*> stack_;
  std::string key_;
};
}  // namespace

json result_to_json(const DesignRecord& r, bool with_steps) {
  JsonWriter w;
  write_result(w, r, with_steps);
  return w.take();
}

}  // namespace armature
