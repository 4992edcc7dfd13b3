// SPDX-License-Identifier: MIT
// The two renderings of one report document: the same text and cells, escaped for each format.
#include <catch2/catch.hpp>
#include <sstream>

#include "model/contract.h"
#include "optimiser/report/html_report.h"
#include "optimiser/report/markdown_report.h"
#include "optimiser/report/study_report.h"

using namespace stowage::report;

namespace {

ReportDocument sample() {
  ReportDocument doc;
  doc.title = "T & <U>";
  doc.subtitle = "sub";
  doc.generated_line = "Generated 1970-01-01T00:00:00Z by stowage";
  ReportSection s;
  s.id = "one";
  s.title = "One";
  s.paragraph("a*b_c");
  ReportTable t;
  t.header = {"name", "value"};
  t.numeric = {false, true};
  t.rows.push_back({{"x|y", "", ""}, {"1,234", "best.npc", "1234.4"}});
  s.table(t);
  doc.sections.push_back(s);
  return doc;
}

}  // namespace

TEST_CASE("the HTML escapes text and tags numbers with their JSON path", "[report]") {
  std::ostringstream out;
  write_report_html(out, sample());
  const std::string html = out.str();
  CHECK(html.rfind("<!DOCTYPE html>\n", 0) == 0);
  CHECK(html.find("<h1>T &amp; &lt;U&gt;</h1>") != std::string::npos);
  CHECK(html.find("<td class=\"num\" data-key=\"best.npc\" data-value=\"1234.4\">1,234</td>") !=
        std::string::npos);
  CHECK(html.find("\nGenerated 1970-01-01T00:00:00Z by stowage\n") != std::string::npos);
  CHECK(html.find("<script") == std::string::npos);
}

TEST_CASE("the Markdown escapes table bars and emphasis", "[report]") {
  std::ostringstream out;
  write_report_markdown(out, sample());
  const std::string md = out.str();
  CHECK(md.find("# T &amp; &lt;U&gt;\n") != std::string::npos);
  CHECK(md.find("a\\*b\\_c\n") != std::string::npos);
  CHECK(md.find("| name | value |\n| --- | ---: |\n| x\\|y | 1,234 |\n") != std::string::npos);
  CHECK(md.find("\nGenerated 1970-01-01T00:00:00Z by stowage\n") != std::string::npos);
}

TEST_CASE("a report without its study or result is a broken contract", "[report]") {
  ReportInputs in;
  CHECK_THROWS_AS(build_study_report(in), stowage::ContractViolation);
}

TEST_CASE("the time stamp follows SOURCE_DATE_EPOCH", "[report]") {
  setenv("SOURCE_DATE_EPOCH", "951782400", 1);  // 2000-02-29T00:00:00Z (a leap day)
  CHECK(report_timestamp() == "2000-02-29T00:00:00Z");
  unsetenv("SOURCE_DATE_EPOCH");
}
