#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# Checks one report output set (stowage report / optimise --report; with --tender, the tender
# report of `stowage tender --report`, whose numbers are checked against tender.json):
#   - report.html is well-formed (xml.etree, and html.parser for balanced tags), self-contained
#     (no script, no external reference) and has print CSS;
#   - every figure is inline in the HTML with the same bytes as its .svg file, has data marks,
#     labelled axes, a title and a description;
#   - every number tagged with a JSON path equals result.json, and its displayed text equals the
#     JSON value to the digits shown;
#   - the SHA-256 of every input file equals Python's hashlib (an independent implementation of
#     FIPS 180-4), and the study digest follows docs/report.md;
#   - report.md renders with python3-markdown and has the same headings, table cells and figures;
#   - the safety cautions are there.
# With --kind KIND (sweep, grid, uncertainty, breakeven: the robustness reports of `sweep`,
# `sweep --grid`, `uncertainty` and `breakeven --report`), the numbers are checked against that
# command's JSON (sweep.json, uncertainty.json, breakeven.json) and the figures against the
# ones that report draws. A number shown as a percentage ("62.5 %") is compared with the JSON's
# fraction.
# Usage: report_check.py DIR [--infeasible] [--tender] [--kind KIND]
import hashlib
import html.parser
import json
import math
import os
import re
import sys
import xml.etree.ElementTree as ET

import markdown

out_dir = sys.argv[1]
infeasible = "--infeasible" in sys.argv
tender = "--tender" in sys.argv
kind = sys.argv[sys.argv.index("--kind") + 1] if "--kind" in sys.argv else None
KIND_JSON = {"sweep": "sweep.json", "grid": "sweep.json", "uncertainty": "uncertainty.json",
             "breakeven": "breakeven.json"}
if kind is not None and kind not in KIND_JSON:
    sys.exit(f"report_check.py: unknown --kind {kind}")
errors = []


def check(cond, msg):
    if not cond:
        errors.append(msg)


def read(name):
    with open(os.path.join(out_dir, name), encoding="utf-8") as f:
        return f.read()


html_text = read("report.html")
json_name = "tender.json" if tender else KIND_JSON[kind] if kind else "result.json"
doc = json.load(open(os.path.join(out_dir, json_name)))

# ---- well-formed, self-contained HTML -----------------------------------------------------
root = ET.fromstring(html_text.split("\n", 1)[1])  # after <!DOCTYPE html>
check(html_text.startswith("<!DOCTYPE html>\n"), "no HTML5 doctype")
XHTML = ""  # the report uses no default namespace on <html>
VOID = {"meta", "br", "hr", "img", "link", "input"}


class Balance(html.parser.HTMLParser):
    def __init__(self):
        super().__init__()
        self.stack = []
        self.problems = []

    def handle_starttag(self, tag, attrs):
        if tag not in VOID:
            self.stack.append(tag)

    def handle_startendtag(self, tag, attrs):
        pass

    def handle_endtag(self, tag):
        if not self.stack or self.stack[-1] != tag:
            self.problems.append(f"</{tag}> closes {self.stack[-1:]}")
        else:
            self.stack.pop()


bal = Balance()
bal.feed(html_text)
check(not bal.problems and not bal.stack, f"unbalanced HTML: {bal.problems[:3]} {bal.stack[:3]}")

all_elements = list(root.iter())
tags = {re.sub(r"\{.*\}", "", e.tag) for e in all_elements}
check("script" not in tags, "the report has a script")
check("link" not in tags and "img" not in tags and "iframe" not in tags, "external resource element")
for e in all_elements:
    for attr in ("src", "href"):
        v = e.get(attr)
        if v is not None:
            check(v.startswith("#"), f"{attr}={v} is not an in-page link")
check("@page" in html_text and "@media print" in html_text, "no print CSS")
check("url(http" not in html_text and "@import" not in html_text, "CSS loads from outside")

# ---- figures --------------------------------------------------------------------------------
SVG = "{http://www.w3.org/2000/svg}"
svg_files = sorted(f for f in os.listdir(out_dir) if f.endswith(".svg"))
inline = re.findall(r"<figure id=\"([^\"]+)\">\n(<svg .*?</svg>\n)", html_text, re.S)
check(len(inline) == len(svg_files), f"{len(inline)} inline figures, {len(svg_files)} .svg files")
if tender:
    check({i for i, _ in inline} == {"fig-bids"}, f"figures {sorted(i for i, _ in inline)}")
elif kind:
    if kind == "sweep":
        want = {"fig-tornado"} if doc["base"]["winner"] is not None else set()
    elif kind == "grid":
        want = {"fig-sweep"} if len(doc["axes"]) == 1 else {"fig-winner-map"}
        if all(p["winner"] is None for p in doc["points"]):
            want = set()
    elif kind == "uncertainty":
        want = {"fig-npc-spread", "fig-npc-ecdf", "fig-lcos-spread", "fig-win-probability"} \
            if doc["profiles"] else set()
    else:
        want = {"fig-breakeven"}
    check({i for i, _ in inline} == want, f"figures {sorted(i for i, _ in inline)}, want {want}")
elif not infeasible:
    want = {"fig-breakdown", "fig-soc", "fig-rainflow", "fig-life", "fig-cycle-life",
            "fig-temperature"}
    if os.path.exists(os.path.join(out_dir, "tornado.json")):
        want.add("fig-tornado")
    check({i for i, _ in inline} == want, f"figures {sorted(i for i, _ in inline)}")
for fig_id, svg_text in inline:
    check(read(fig_id + ".svg") == svg_text, f"{fig_id}: inline SVG differs from {fig_id}.svg")
    svg = ET.fromstring(svg_text)
    check((svg.findtext(SVG + "title") or "").strip() != "", f"{fig_id}: no title")
    check((svg.findtext(SVG + "desc") or "").strip() != "", f"{fig_id}: no desc")
    data = [g for g in svg.iter(SVG + "g") if g.get("class") == "data"]
    marks = sum(len(list(g)) for g in data)
    check(marks > 0, f"{fig_id}: no data marks")
    for axis in ("x", "y"):
        groups = [g for g in svg.iter(SVG + "g") if g.get("class") == "axis " + axis]
        check(groups, f"{fig_id}: no {axis} axis")
        for g in groups:
            labels = [t for t in g.iter(SVG + "text") if t.get("class") == "axis-label"]
            check(labels and all((t.text or "").strip() for t in labels),
                  f"{fig_id}: {axis} axis without a label")
            ticks = [t for t in g.iter(SVG + "text") if t.get("class") == "tick"]
            check(len(ticks) >= 2, f"{fig_id}: {axis} axis with fewer than 2 ticks")
    # Units or a named quantity on every axis label: "(unit)" or a plain quantity name.
    for t in svg.iter(SVG + "text"):
        if t.get("class") == "axis-label":
            check(len((t.text or "").strip()) >= 4, f"{fig_id}: axis label too short")

# ---- numbers against result.json ------------------------------------------------------------


def resolve(path):
    node = doc
    for part in re.findall(r"[^.\[\]]+|\[\d+\]", path):
        node = node[int(part[1:-1])] if part.startswith("[") else node[part]
    return node


tagged = [e for e in all_elements if e.get("data-key") is not None]
keys = {e.get("data-key") for e in tagged}
if tender:
    for i, bid in enumerate(doc["bids"]):
        for field in ("npc", "lcos_per_kwh", "lcos_schmidt_per_kwh", "liquidated_damages",
                      "warranty_end_years", "design.breakdown.investment", "label"):
            check(f"bids[{i}].{field}" in keys, f"no tagged number for bids[{i}].{field}")
        if bid["rank"] is not None:
            for field in ("rank", "price_score", "technical_score", "total_score"):
                check(f"bids[{i}].{field}" in keys, f"no tagged number for bids[{i}].{field}")
        for j in range(len(bid["shortfalls"])):
            check(f"bids[{i}].shortfalls[{j}].offered" in keys, f"shortfall {i}.{j} not shown")
    check(len(tagged) >= 40, f"only {len(tagged)} tagged numbers")
elif kind == "uncertainty":
    for i in range(len(doc["profiles"])):
        for field in ("win_probability", "win_probability_se", "npc.p10", "npc.p50", "npc.p90",
                      "lcos_per_kwh.p50", "expected_regret", "fails_limit"):
            check(f"profiles[{i}].{field}" in keys, f"no tagged number for profiles[{i}].{field}")
elif kind == "breakeven":
    for i in range(len(doc["scan"])):
        check(f"scan[{i}].value" in keys, f"no tagged number for scan[{i}].value")
    if doc["crossing"]:
        for must in ("value", "bracket_low", "bracket_high"):
            check(must in keys, f"no tagged number for {must}")
elif kind == "grid":
    for k, point in enumerate(doc["points"]):
        for j in range(len(point["designs"])):
            check(f"points[{k}].designs[{j}].npc" in keys, f"no tagged NPC at point {k}, {j}")
        if point["winner"] is not None:
            check(f"points[{k}].winner" in keys, f"no tagged winner at point {k}")
elif kind == "sweep":
    if doc["base"]["winner"] is not None:
        check("base.winner" in keys, "no tagged base.winner")
        check(any(k.startswith("base.designs[") and k.endswith(".npc") for k in keys),
              "no tagged base NPC")
elif not infeasible:
    for must in ("best.npc", "best.lcos_per_kwh", "best.profile", "best.dod_setpoint",
                 "ranking[1].npc_difference_to_best", "ranking[0].design.breakdown.investment",
                 "optimality"):
        check(must in keys, f"no tagged number for {must}")
    check(len(tagged) >= 40, f"only {len(tagged)} tagged numbers")
for e in tagged:
    key, machine, shown = e.get("data-key"), e.get("data-value"), (e.text or "").strip()
    try:
        value = resolve(key)
    except (KeyError, IndexError, TypeError):
        errors.append(f"{key}: not in result.json")
        continue
    if isinstance(value, str):
        check(machine == value and shown == value, f"{key}: {shown!r} / {machine!r} vs {value!r}")
        continue
    check(math.isclose(float(machine), value, rel_tol=1e-9, abs_tol=1e-9),
          f"{key}: data-value {machine} vs JSON {value}")
    number = shown.replace(",", "").replace("+", "")
    scale = 1
    if number.endswith(" %"):  # a fraction shown as a percentage
        number, scale = number[:-2], 100
    decimals = len(number.split(".")[1]) if "." in number else 0
    check(abs(float(number) - scale * value) <= 0.5 * 10 ** -decimals + 1e-9,
          f"{key}: shown {shown!r} is not JSON {value} to {decimals} decimals")

# ---- input hashes ---------------------------------------------------------------------------
rows = []
for table in root.iter("table"):
    cap = table.find("caption")
    if cap is not None and cap.text and cap.text.startswith("Input files"):
        for tr in table.find("tbody"):
            rows.append([td.text or "" for td in tr])
check(len(rows) >= 3, "no input-file hash table")
lines = ""
for role, path, size, digest in rows:
    data = open(path, "rb").read()
    check(hashlib.sha256(data).hexdigest() == digest, f"SHA-256 of {path}")
    check(int(size) == len(data), f"size of {path}")
    lines += f"{digest}  {role}\n"
study_digest = hashlib.sha256(lines.encode()).hexdigest()
check(study_digest in html_text, "study digest is not the SHA-256 of the per-file lines")

# ---- Markdown: same content ---------------------------------------------------------------
md_text = read("report.md")
md_html = markdown.markdown(md_text, extensions=["tables"])
md_root = ET.fromstring("<div>" + md_html.replace("&nbsp;", " ") + "</div>")


def cells(tree):
    return [("".join(td.itertext())).strip() for td in tree.iter() if td.tag in ("td", "th")]


def headings(tree, tag):
    return [("".join(h.itertext())).strip() for h in tree.iter(tag)]


check(cells(md_root) == cells(root), "Markdown tables differ from the HTML tables")
check(len(cells(root)) > (20 if kind else 50), "too few table cells")
check(headings(md_root, "h2") == headings(root, "h2"), "Markdown sections differ")
images = [img.get("src") for img in md_root.iter("img")]
check(images == [i + ".svg" for i, _ in inline], f"Markdown images {images}")
for img in images:
    check(os.path.exists(os.path.join(out_dir, img)), f"{img} missing beside report.md")
check(len(re.findall(r"^Generated ", md_text, re.M)) == 1, "Markdown has no Generated line")

# ---- safety ---------------------------------------------------------------------------------
notice = " ".join("".join(d.itertext()) for d in root.iter("div") if d.get("class") == "notice")
for word in ("hydrogen", "thermal runaway", "DC arcs", "electrolyte", "weight", "local codes",
             "licensed practice"):
    check(word in notice, f"safety notice lacks {word!r}")
    check(word in md_text, f"Markdown lacks {word!r}")

# ---- sensitivity section against tornado.json -----------------------------------------------
tornado_path = os.path.join(out_dir, "sweep.json" if kind == "sweep" else "tornado.json")
if os.path.exists(tornado_path) and (kind is None or kind == "sweep") and \
        json.load(open(tornado_path))["base"]["winner"] is not None:
    tornado = json.load(open(tornado_path))
    m = re.search(r'<section id="sensitivity".*?</section>', html_text, re.S)
    check(m is not None, "tornado.json without a sensitivity section")
    if m:
        section = m.group(0)
        for bar in tornado["bars"]:
            for end in ("low", "high"):
                point = bar[end]
                if point["winner"] is None:
                    continue
                npc = next(d["npc"] for d in point["designs"] if d["profile"] == point["winner"])
                text = f"{npc:,.0f}"
                check(f">{text}<" in section,
                      f"sensitivity: {bar['variation']['path']} {end}: NPC {text} not in the table")

if errors:
    for e in errors[:40]:
        print("FAIL:", e, file=sys.stderr)
    sys.exit(1)
print(f"report ok: {len(inline)} figures, {len(tagged)} numbers checked against {json_name}")

