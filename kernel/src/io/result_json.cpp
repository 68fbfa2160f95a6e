// The result of contract.md as nlohmann::json, through the shared schema of
// result_writer.hpp.
#include <charconv>
#include <cmath>
#include <cstdio>

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
  void value(long long v) { put(v); }
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

// Writes JSON text straight from the writer calls, keys in the schema's
// order. Numbers take their shortest form that reads back to the same
// double, with ".0" on whole numbers and null for non-finite values, as
// nlohmann::json writes them.
class TextWriter {
 public:
  explicit TextWriter(int indent) : indent_(indent) { out_.reserve(16384); }
  void begin_object() { open('{'); }
  void begin_array() { open('['); }
  void end() {
    const Frame f = stack_.back();
    stack_.pop_back();
    if (f.items > 0 && indent_ >= 0) newline(stack_.size());
    out_ += f.object ? '}' : ']';
  }
  void key(const char* k) { key_ = k; }
  void value(double v) {
    item();
    if (!std::isfinite(v)) {
      out_ += "null";
      return;
    }
    char buffer[32];
    const auto [end, ec] = std::to_chars(buffer, buffer + sizeof buffer, v);
    std::string_view text(buffer, static_cast<std::size_t>(end - buffer));
    out_ += text;
    if (text.find_first_of(".e") == std::string_view::npos) out_ += ".0";
  }
  void value(long long v) {
    item();
    char buffer[24];
    const auto [end, ec] = std::to_chars(buffer, buffer + sizeof buffer, v);
    out_.append(buffer, end);
  }
  void value(bool v) {
    item();
    out_ += v ? "true" : "false";
  }
  void value(const std::string& v) {
    item();
    quoted(v);
  }
  void value(const char* v) {
    item();
    quoted(v);
  }
  std::string take() { return std::move(out_); }

 private:
  struct Frame {
    bool object;
    std::size_t items;
  };
  void open(char bracket) {
    item();
    out_ += bracket;
    stack_.push_back({bracket == '{', 0});
  }
  // Separator, line break and key before a value inside a container.
  void item() {
    if (stack_.empty()) return;
    Frame& f = stack_.back();
    if (f.items++ > 0) out_ += ',';
    if (indent_ >= 0) newline(stack_.size());
    if (f.object) {
      quoted(key_);
      out_ += indent_ >= 0 ? ": " : ":";
    }
  }
  void newline(std::size_t depth) {
    out_ += '\n';
    out_.append(depth * static_cast<std::size_t>(indent_), ' ');
  }
  void quoted(std::string_view text) {
    out_ += '"';
    std::size_t plain = 0;  // start of the run of characters copied as they are
    for (std::size_t i = 0; i < text.size(); ++i) {
      const auto c = static_cast<unsigned char>(text[i]);
      if (c >= 0x20 && c != '"' && c != '\\') continue;
      out_.append(text, plain, i - plain);
      plain = i + 1;
      switch (c) {
        case '"': out_ += "\\\""; break;
        case '\\': out_ += "\\\\"; break;
        case '\n': out_ += "\\n"; break;
        case '\r': out_ += "\\r"; break;
        case '\t': out_ += "\\t"; break;
        case '\b': out_ += "\\b"; break;
        case '\f': out_ += "\\f"; break;
        default: {
          char u[8];
          std::snprintf(u, sizeof u, "\\u%04x", static_cast<unsigned>(c));
          out_ += u;
        }
      }
    }
    out_.append(text, plain, std::string_view::npos);
    out_ += '"';
  }

  int indent_;
  std::string out_;
  std::vector<Frame> stack_;
  std::string_view key_;
};

}  // namespace

std::string result_to_json_text(const DesignRecord& r, int indent, bool with_steps) {
  TextWriter w(indent);
  write_result(w, r, with_steps);
  return w.take();
}


json result_to_json(const DesignRecord& r, bool with_steps) {
  JsonWriter w;
  write_result(w, r, with_steps);
  return w.take();
}

}  // namespace armature
