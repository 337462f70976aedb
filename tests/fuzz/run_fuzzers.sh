#!/usr/bin/env bash
# Builds the libFuzzer targets of the file readers with clang (-fsanitize=fuzzer,address) in
# their own build folder and runs each for a bounded time, starting from the committed seeds.
#
#   tests/fuzz/run_fuzzers.sh [SECONDS_PER_TARGET] [TARGET...]   default 60 s, every target
#   tests/fuzz/run_fuzzers.sh --runs N [TARGET...]   N runs per target (e.g. 1000000)
#   tests/fuzz/run_fuzzers.sh --make-seeds               regenerate corpus/ with gramline-cli
#
# Targets run one at a time under nice. fuzz_bundle mutates whole zip files (the archive layer);
# fuzz_bundle_entries mutates the entries and zips them with a correct manifest, so its inputs
# reach the campaign and steps readers and the plan rebuilt from the steps. The normal test run
# only replays corpus/ once (gramline_fuzz_replay).
#
# Needs clang and its runtime: apt-get install -y clang libclang-rt-14-dev
# Findings land in BUILD/fuzz-findings/<target>/; a summary line per target is printed.
# Exit status: 0 no findings, 1 findings, 2 cannot build.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
build=${GRAMLINE_FUZZ_BUILD:-$root/build-fuzz}
targets=(campaign_json data_csv counts_csv bundle bundle_entries)

if ! command -v clang++ >/dev/null; then
  echo "run_fuzzers.sh: clang++ not found (apt-get install -y clang libclang-rt-14-dev)" >&2
  exit 2
fi

make_seeds() {
  # Seeds come from our own CLI and demo; each stays well under 100 KB.
  local cli=$1 tmp
  tmp=$(mktemp -d)
  mkdir -p "$here/corpus/"{campaign_json,data_csv,counts_csv,bundle,bundle_entries}
  "$cli" demo --out "$tmp/demo.json" >/dev/null
  cp "$tmp/demo.json" "$here/corpus/campaign_json/demo.json"
  "$cli" export "$tmp/demo.json" --data "$root/tests/data/small_two_features.csv" \
    --out "$tmp/small.zip" >/dev/null
  cp "$tmp/small.zip" "$here/corpus/bundle/small.zip"
  (cd "$tmp" && unzip -q -o small.zip)
  cp "$tmp/campaign.json" "$here/corpus/campaign_json/small.json"
  cp "$tmp/data.csv" "$here/corpus/data_csv/small.csv"
  cp "$root/tests/data/good_names.csv" "$here/corpus/data_csv/names.csv"
  # Counts: the first byte picks the layout ('1': two photons, both ports); one row per
  # measure or reference step of the small bundle, counts invented, interval = its dwell.
  awk -F, 'NR == 1 { for (i = 1; i <= NF; ++i) col[$i] = i; next }
           $2 == "measure" || $2 == "reference" {
             s = $(col["start_s"]) + $(col["move_s"]); e = s + $(col["dwell_s"]);
             printf "%s,%s,%.6f,%.6f,%d,%d,%d,%d\n", $1, $2, s, e, 900 + NR, 40 + NR, 38, 3 }' \
    "$tmp/steps.csv" >"$tmp/rows.csv"
  { printf '1step,kind,start_s,end_s,ch0,ch1,ch2,ch3\n'; cat "$tmp/rows.csv"; } \
    >"$here/corpus/counts_csv/small.csv"
  { printf '1# with singles\nstep,kind,start_s,end_s,ch0,ch1,ch2,ch3,singles0_per_s,singles1_per_s\n'
    head -3 "$tmp/rows.csv" | sed 's/$/,41000,39500.5/'; } >"$here/corpus/counts_csv/singles.csv"
  printf '5step,kind,start_s,end_s,ch0\n1,measure,0,2.5,77\n' >"$here/corpus/counts_csv/pass_only.csv"
  # A resumed bundle: the first half of the counted rows, then resume.
  head -n "$(($(wc -l <"$here/corpus/counts_csv/small.csv") / 2))" \
    "$here/corpus/counts_csv/small.csv" | tail -c +2 >"$tmp/half.csv"
  "$cli" resume "$tmp/small.zip" "$tmp/half.csv" --out "$tmp/resumed.zip" >/dev/null
  cp "$tmp/resumed.zip" "$here/corpus/bundle/resumed.zip"
  # Entry-level seeds: the entries the reader parses, each after a line "@@ NAME".
  for z in small resumed; do
    mkdir -p "$tmp/$z" && (cd "$tmp/$z" && unzip -q -o "$tmp/$z.zip")
    for f in $(cd "$tmp/$z" && ls | grep -E \
      '^(campaign.json|steps.json|measured_steps.json|measured_counts.csv|resume.json)$'); do
      printf '@@ %s\n' "$f"
      cat "$tmp/$z/$f"
    done >"$here/corpus/bundle_entries/$z.txt"
  done
  # A signature entry (not under the fuzz key) so mutations reach the signature check.
  { cat "$here/corpus/bundle_entries/small.txt"
    printf '@@ signature.json\n{"format": "gramline-signature", "version": 1, "algorithm": '
    printf '"HMAC-SHA-256", "signs": "manifest.json", "key_id": "0123456789abcdef", "hmac": "00"}\n'
  } >"$here/corpus/bundle_entries/signed.txt"
  # Feature names the data CSV reserves (" label " quoted, " set"): refused by every reader.
  printf '" label ",label\n0,a\n1,b' >"$here/corpus/data_csv/label_name.csv"
  printf '" set",label\n0,a\n1,b' >"$here/corpus/data_csv/set_name.csv"
  rm -rf "$tmp"
  du -ab "$here/corpus"
}

if [[ ${1:-} == --make-seeds ]]; then
  cli=${GRAMLINE_CLI:-$root/build/app/gramline-cli}
  [[ -x $cli ]] || { echo "set GRAMLINE_CLI to a built gramline-cli" >&2; exit 2; }
  make_seeds "$cli"
  exit 0
fi

limit=(-max_total_time=60)
what="60 s"
if [[ ${1:-} == --runs ]]; then
  limit=(-runs="$2")
  what="$2 runs"
  shift 2
elif [[ ${1:-} =~ ^[0-9]+$ ]]; then
  limit=(-max_total_time="$1")
  what="$1 s"
  shift
fi
[[ $# -gt 0 ]] && targets=("$@")
cmake -S "$root" -B "$build" -G Ninja -DCMAKE_CXX_COMPILER=clang++ \
  -DCMAKE_BUILD_TYPE=RelWithDebInfo -DGRAMLINE_FUZZ=ON -DGRAMLINE_BUILD_APP=OFF \
  -DGRAMLINE_BUILD_BENCH=OFF \
  -DCMAKE_CXX_FLAGS="-fsanitize=fuzzer-no-link,address -fno-omit-frame-pointer" >/dev/null ||
  exit 2
cmake --build "$build" -j2 --target "${targets[@]/#/fuzz_}" >/dev/null || exit 2

found=0
for t in "${targets[@]}"; do
  work=$build/fuzz-work/$t
  findings=$build/fuzz-findings/$t
  mkdir -p "$work" "$findings"
  log=$build/fuzz-findings/$t.log
  # libFuzzer stops at the first finding; fix it, keep it as a regression test, run again.
  nice "$build/tests/fuzz/fuzz_$t" "$work" "$here/corpus/$t" "${limit[@]}" \
    -timeout=10 -rss_limit_mb=2048 -max_len=262144 -print_final_stats=1 \
    -artifact_prefix="$findings/" >"$log" 2>&1 || true
  execs=$(grep -o 'stat::number_of_executed_units: *[0-9]*' "$log" | grep -o '[0-9]*$' | tail -1)
  crashes=$(find "$findings" -type f \( -name 'crash-*' -o -name 'leak-*' -o -name 'timeout-*' \
    -o -name 'oom-*' \) | wc -l)
  edges=$(grep -o 'cov: [0-9]*' "$log" | tail -1 | grep -o '[0-9]*')
  secs=$(grep -o 'Done [0-9]* runs in [0-9]* second' "$log" | grep -o 'in [0-9]*' | grep -o '[0-9]*')
  echo "fuzz_$t ($what): ${execs:-?} runs in ${secs:-?} s, ${edges:-?} edges, corpus $(find "$work" -type f | wc -l) inputs, findings $crashes (log $log)"
  [[ $crashes -eq 0 ]] || found=1
done
exit $found
