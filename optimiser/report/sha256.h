// SPDX-License-Identifier: MIT
// SHA-256 as specified in FIPS PUB 180-4 (Secure Hash Standard, August 2015), section 6.2:
// messages of any length in bytes, padded per section 5.1.1, parsed into 512-bit blocks
// (5.2.1), initial hash value of section 5.3.3, constants K of section 4.2.2. Written here so
// the report needs no crypto library; checked against the FIPS 180-4 / NIST example vectors
// (tests/report/sha256_test.cpp).
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

namespace stowage::report {

class Sha256 {
 public:
  Sha256();
  void update(const void* data, std::size_t size);
  void update(std::string_view text) { update(text.data(), text.size()); }
  // The 32-byte digest; the object must not be updated afterwards (ContractViolation).
  std::array<std::uint8_t, 32> finish();
  // finish() as 64 lower-case hexadecimal digits.
  std::string finish_hex();

 private:
  void compress(const std::uint8_t* block);
  std::array<std::uint32_t, 8> h_;
  std::array<std::uint8_t, 64> buffer_{};
  std::size_t buffered_ = 0;
  std::uint64_t length_bytes_ = 0;
  bool finished_ = false;
};

// SHA-256 of a byte string, as lower-case hex.
std::string sha256_hex(std::string_view bytes);

}  // namespace stowage::report
