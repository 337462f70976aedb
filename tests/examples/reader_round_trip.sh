#!/usr/bin/env bash
# reader_round_trip.sh GRAMLINE_CLI EXAMPLES_DIR THIS_DIR
# The Python reader of docs/examples/ on a bundle that gramline-cli really exported, from a
# campaign whose motors have motor units: it verifies the manifest, its motor units agree with
# steps.csv, a changed file is refused, and the counts it writes ingest (docs/counts-format.md).
set -euo pipefail
cli="$1"
examples="$2"
here="$3"
if ! command -v python3 >/dev/null 2>&1; then
  echo "SKIP: python3 is not installed"
  exit 77
fi
# Leave no bytecode in the source tree.
export PYTHONDONTWRITEBYTECODE=1
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
cd "$work"

"$cli" demo --out demo.json >/dev/null
# Motor units on every motor but the last (that one keeps degrees): invented values, a
# 400-step motor with 16 microsteps (17.77... steps per degree) and a coarse 1-degree encoder.
python3 - <<'PY'
import json
c = json.load(open("demo.json"))
motors = c["rig"]["motors"]
for k, m in enumerate(motors[:-1]):
    m["steps_per_deg"] = 6400 / 360 if k % 2 == 0 else 1.0
    m["zero_offset_deg"] = [12.5, -37.25, 0.0, 181.0][k % 4]
json.dump(c, open("units.json", "w"), indent=1)
PY
"$cli" export units.json --out night.zip >/dev/null

python3 "$examples/read_bundle.py" night.zip --list --units steps >list.txt
grep -q "verified" list.txt

# Independent checks of the motor-unit columns and of kernel_rounding_max, from the documented
# formulas (docs/plan-files.md, "Motor units"; docs/conventions.md for the Jones calculus).
PYTHONPATH="$examples" python3 "$here/check_motor_units.py" night.zip

python3 "$examples/read_bundle.py" night.zip --dry-run-counts counts.csv >/dev/null
head -1 counts.csv | grep -q "^# bundle file: night.zip, manifest SHA-256 [0-9a-f]\{64\}$"
sed -n 2p counts.csv | grep -q "^# simulated: "
"$cli" ingest night.zip counts.csv --out ingested >ingest.txt
grep -q "simulated counts" ingest.txt
python3 - <<'PY'
import json
j = json.load(open("ingested/ingest.json"))
assert j["simulated"] is True, j["simulated"]
assert j["measured_entries"] == j["expected_entries"] > 0, (j["measured_entries"],
                                                           j["expected_entries"])
assert j["missing_steps"] == [], j["missing_steps"]
# Expected counts carry no noise: every z-score is far inside one predicted sigma.
assert abs(j["z_mean"]) < 0.5 and j["z_std"] < 0.5, (j["z_mean"], j["z_std"])
PY

# A bundle with one file changed after export is refused, naming the file.
python3 - <<'PY'
import zipfile
with zipfile.ZipFile("night.zip") as src, zipfile.ZipFile("changed.zip", "w") as dst:
    for info in src.infolist():
        data = src.read(info.filename)
        if info.filename == "steps.csv":
            data = data.replace(b",measure,", b",reference,", 1)
        dst.writestr(info, data)
PY
if python3 "$examples/read_bundle.py" changed.zip 2>err.txt; then
  echo "FAIL: the changed bundle was accepted" >&2
  exit 1
fi
grep -q "steps.csv" err.txt
echo "reader round trip: ok"
