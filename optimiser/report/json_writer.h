// SPDX-License-Identifier: MIT
// JsonWriter: a small streaming JSON writer for the command line's --format json output.
// Keeps commas and nesting right; numbers are written with up to 12 significant digits and
// non-finite numbers as null (JSON has no NaN).
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace stowage::report {

class JsonWriter {
 public:
  JsonWriter& begin_object();
  JsonWriter& end_object();
  JsonWriter& begin_array();
  JsonWriter& end_array();
  JsonWriter& key(std::string_view name);
  JsonWriter& value(double number);
  JsonWriter& value(int number);
  JsonWriter& value(long number);
  JsonWriter& value(bool flag);
  JsonWriter& value(std::string_view text);
  JsonWriter& value(const char* text) { return value(std::string_view(text)); }
  JsonWriter& null();
  // key(name).value(v) in one call.
  template <typename T>
  JsonWriter& field(std::string_view name, const T& v) {
    key(name);
    return value(v);
  }
  const std::string& str() const { return out_; }

 private:
  void before_value();
  void write_string(std::string_view text);
  std::string out_;
  std::vector<bool> first_;  // per open container: no element written yet
  bool after_key_ = false;
};

}  // namespace stowage::report
