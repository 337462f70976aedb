#!/bin/sh
# Renders every view of the desktop app (and every page of the campaign editor) into a folder
# of PNG files, under a virtual X server, for review.
# Usage: app/gui/tools/screenshot_views.sh [OUT_DIR] [CAMPAIGN_FILE]
#   OUT_DIR defaults to build/screenshots; without CAMPAIGN_FILE the bundled demo is shown.
#   GRAMLINE_APP may name the binary (default: the first of build*/app/gui/gramline).
# The Measured view shows simulated counts: the campaign is exported with gramline-cli and its
# counts drawn from the rig model by tests/gui's gramline_simulated_counts (both from the app's
# build folder; without them the view's empty page is shot). SCREENSHOT_FADE (default 0) makes
# the simulated pair rate fall by that share per hour, to show drifted reference steps.
set -eu
here=$(cd "$(dirname "$0")/../../.." && pwd)
out=${1:-"$here/build/screenshots"}
campaign=${2:-}
app=${GRAMLINE_APP:-}
if [ -z "$app" ]; then
  for candidate in "$here"/build/app/gui/gramline "$here"/build-*/app/gui/gramline; do
    if [ -x "$candidate" ]; then app=$candidate; break; fi
  done
fi
if [ -z "$app" ] || [ ! -x "$app" ]; then
  echo "screenshot_views.sh: build the app first (cmake --build BUILD --target gramline)" >&2
  exit 2
fi
command -v xvfb-run >/dev/null 2>&1 || { echo "screenshot_views.sh: needs xvfb-run (apt-get install xvfb)" >&2; exit 2; }
mkdir -p "$out"
build=$(cd "$(dirname "$app")/../.." && pwd)
cli=$build/app/gramline-cli
sim=$build/tests/gui/gramline_simulated_counts
# A private settings folder: the saved window layout of whoever runs this must not change the
# pictures.
export XDG_CONFIG_HOME="$(mktemp -d)"
export XDG_DATA_HOME="$XDG_CONFIG_HOME"
trap 'rm -rf "$XDG_CONFIG_HOME"' EXIT
# shoot OUT_DIR [CAMPAIGN]: every view and editor page of one campaign (the demo without one).
shoot() {
  shoot_out=$1
  shoot_campaign=${2:-}
  mkdir -p "$shoot_out"
  if [ -x "$cli" ] && [ -x "$sim" ]; then
    inputs=$(mktemp -d "$XDG_CONFIG_HOME/measured.XXXXXX")
    source_campaign=$shoot_campaign
    if [ -z "$source_campaign" ]; then
      source_campaign=$inputs/demo.json
      "$cli" demo --out "$source_campaign" >/dev/null
    fi
    "$cli" export "$source_campaign" --out "$inputs/night.zip" >/dev/null
    "$sim" "$inputs/night.zip" "$inputs/night-counts.csv" --seed 7 --fade "${SCREENSHOT_FADE:-0}"
    export GRAMLINE_SCREENSHOT_BUNDLE="$inputs/night.zip"
    export GRAMLINE_SCREENSHOT_COUNTS="$inputs/night-counts.csv"
  else
    echo "screenshot_views.sh: no gramline-cli or gramline_simulated_counts in $build;" \
      "the Measured view shows its empty page" >&2
  fi
  if [ -n "$shoot_campaign" ]; then
    xvfb-run -a -s "-screen 0 1600x1000x24" "$app" --screenshots "$shoot_out" "$shoot_campaign"
  else
    xvfb-run -a -s "-screen 0 1600x1000x24" "$app" --screenshots "$shoot_out"
  fi
}

shoot "$out" "$campaign"

# A three-photon campaign of one's own data (five features spread over three photons), made by
# `gramline-cli new` from an invented data set, in every view too.
if [ -x "$cli" ]; then
  three=$XDG_CONFIG_HOME/three-photon
  mkdir -p "$three"
  awk 'BEGIN {
    print "m0,m1,m2,m3,m4,label,set"
    s = 11
    for (i = 0; i < 26; i++) {
      line = ""
      for (f = 0; f < 5; f++) { s = (s * 1103515245 + 12345) % 2147483648; line = line sprintf("%.3f,", s / 2147483648 * 10) }
      print line (i % 2 ? "bad" : "good") "," (i < 20 ? "train" : "test")
    }
  }' > "$three/own.csv"
  "$cli" new --data "$three/own.csv" --out "$three/three-photon.json" --photons 3 >/dev/null
  shoot "$out/three-photon" "$three/three-photon.json"
fi
echo "Screenshots in $out:"
ls -R "$out"
