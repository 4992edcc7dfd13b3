// SPDX-License-Identifier: MIT
// SHA-256 against the example vectors of FIPS PUB 180-4 (NIST CSRC "Examples with
// intermediate values", SHA256.pdf and SHA2_Additional.pdf) and the padding boundaries.
#include "optimiser/report/sha256.h"

#include <catch2/catch.hpp>
#include <string>

#include "model/contract.h"

using stowage::report::Sha256;
using stowage::report::sha256_hex;

TEST_CASE("sha256 of the one-block message abc", "[sha256]") {
  // FIPS 180-4 example, SHA256.pdf: "abc".
  CHECK(sha256_hex("abc") == "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
}

TEST_CASE("sha256 of the 448-bit two-block message", "[sha256]") {
  // FIPS 180-4 example, SHA256.pdf: the 56-byte message, which needs a second padding block.
  CHECK(sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq") ==
        "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
}

TEST_CASE("sha256 of the empty message", "[sha256]") {
  // NIST SHA2_Additional.pdf: the empty message (0 bits).
  CHECK(sha256_hex("") == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}

TEST_CASE("sha256 of one million a fed in uneven pieces", "[sha256]") {
  // NIST SHA2_Additional.pdf: 10^6 repetitions of "a". Fed in pieces of 1..97 bytes so that
  // the block buffering is crossed at every offset.
  Sha256 hash;
  const std::string chunk(97, 'a');
  std::size_t left = 1000000, piece = 1;
  while (left > 0) {
    const std::size_t take = std::min(left, piece);
    hash.update(chunk.data(), take);
    left -= take;
    piece = piece % 97 + 1;
  }
  CHECK(hash.finish_hex() == "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
}

TEST_CASE("sha256 refuses to be used after finish", "[sha256]") {
  Sha256 hash;
  hash.update("abc");
  (void)hash.finish();
  CHECK_THROWS_AS(hash.update("d"), stowage::ContractViolation);
  CHECK_THROWS_AS(hash.finish(), stowage::ContractViolation);
}
