#!/usr/bin/env bash
# Gramline quick start for a fresh Debian 12 machine (run as root, from the checkout).
#   packaging/quickstart.sh demo   install what is missing, build, run the demo campaign
#   packaging/quickstart.sh test   install what is missing, build, run every test (among them:
#                                  install into a staging folder and run the installed CLI on
#                                  the demo; build the .deb and .tar.gz and check them)
# Both are idempotent: packages already present are not reinstalled, the build is incremental.
set -euo pipefail

mode="${1:-}"
case "$mode" in
  demo|test) ;;
  *) echo "usage: $0 demo|test" >&2; exit 2 ;;
esac

here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
build="${GRAMLINE_BUILD_DIR:-$here/build}"
jobs="$(nproc 2>/dev/null || echo 2)"

packages=(
  cmake ninja-build g++ pkg-config
  qt6-base-dev qt6-charts-dev qt6-tools-dev qt6-tools-dev-tools qt6-l10n-tools
  libgl-dev libqt6opengl6-dev libquazip1-qt6-dev libeigen3-dev
  libgtest-dev libsvm-dev libboost-math-dev
  desktop-file-utils appstream dpkg-dev fakeroot file qt6-translations-l10n qt6-qpa-plugins
)
missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if ((${#missing[@]})); then
  echo "== installing: ${missing[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq --no-install-recommends "${missing[@]}"
fi

echo "== building in $build"
cmake -S "$here" -B "$build" -G Ninja -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
cmake --build "$build" -j"$jobs"

if [[ "$mode" == test ]]; then
  echo "== running tests"
  cd "$build"
  QT_QPA_PLATFORM=offscreen ctest --output-on-failure -j"$jobs"
  exit $?
fi

cli="$build/app/gramline-cli"
app="$build/app/gui/gramline"
campaign="$build/demo.gramline.json"
# The demo campaign may have been edited and saved in the app since the last run: keep it.
if [[ -e "$campaign" ]]; then
  echo "== using the existing $campaign (delete it for a fresh demo)"
else
  "$cli" demo --out "$campaign"
fi
if [[ -n "${DISPLAY:-}${WAYLAND_DISPLAY:-}" && -x "$app" ]]; then
  echo "== starting the app on the demo campaign"
  exec "$app" "$campaign"
fi
echo "== no display: planning the demo with the command line"
# build/demo-plan holds only what this script wrote last time: re-plan over it.
"$cli" plan "$campaign" --out "$build/demo-plan" --force
cat <<MSG

Plan files written to $build/demo-plan (steps.json, steps.csv, summary.json, kernel.csv).
To open the demo in the desktop app, run on a machine with a display:
  $app $campaign
MSG
