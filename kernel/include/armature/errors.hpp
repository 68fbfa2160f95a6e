// Error types of the kernel. Input problems are collected (one per field)
// and raised together; faults inside a code plug-in become DesignError.
#pragma once

#include <stdexcept>
#include <string>
#include <vector>

namespace armature {

// One problem with a request, with the dotted path of the field.
struct InputProblem {
  std::string field;    // "slab.thickness_mm", "reinforcement.bars[2]"
  std::string message;  // "must be between 50 and 1500 mm, got -200"
  std::string text() const { return field + ": " + message; }
};

class InputProblems {
 public:
  void add(std::string field, std::string message) {
    items_.push_back({std::move(field), std::move(message)});
  }
  bool empty() const { return items_.empty(); }
  const std::vector<InputProblem>& items() const { return items_; }
  bool has_field(const std::string& field) const;
  // Throws InputError when any problem was recorded.
  void raise_if_any() const;

 private:
  std::vector<InputProblem> items_;
};

// A bad request: what() lists every problem, one per line.
class InputError : public std::invalid_argument {
 public:
  explicit InputError(std::vector<InputProblem> problems);
  const std::vector<InputProblem>& problems() const { return problems_; }

 private:
  std::vector<InputProblem> problems_;
};

// The design could not be completed because a code plug-in failed.
class DesignError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// Thrown by a code's check function (see run_check in code.hpp) so that
// the kernel can name the check that failed.
class CheckError : public std::runtime_error {
 public:
  CheckError(std::string check_id, const std::string& what)
      : std::runtime_error(what), check_id_(std::move(check_id)) {}
  const std::string& check_id() const { return check_id_; }

 private:
  std::string check_id_;
};

}  // namespace armature
