#!/usr/bin/env bash
# install_staged.sh BUILD_DIR VERSION WITH_APP
# Installs the build into a staging folder (DESTDIR) as a package would, checks the installed
# files, then runs the INSTALLED gramline-cli on the demo: demo, then plan --out, which must
# exit 0 and write the four plan files. With the app, also starts the installed gramline.
set -euo pipefail
build="$1"
version="$2"
with_app="${3:-ON}"

stage="$(mktemp -d "${TMPDIR:-/tmp}/gramline-stage.XXXXXX")"
trap 'rm -rf "$stage"' EXIT
fail() { echo "FAIL: $*" >&2; exit 1; }

DESTDIR="$stage/root" cmake --install "$build" --prefix /usr >"$stage/install.log" ||
  { cat "$stage/install.log" >&2; fail "cmake --install failed"; }
root="$stage/root/usr"
id=io.github.gramline.Gramline

expect=(bin/gramline-cli share/man/man1/gramline-cli.1.gz share/doc/gramline/README.md
        share/doc/gramline/LICENSE)
if [[ "$with_app" == ON ]]; then
  expect+=(bin/gramline share/man/man1/gramline.1.gz share/applications/$id.desktop
           share/metainfo/$id.metainfo.xml share/mime/packages/gramline.xml
           share/icons/hicolor/scalable/apps/$id.svg)
  for px in 16 32 48 64 128 256; do expect+=(share/icons/hicolor/${px}x${px}/apps/$id.png); done
fi
for f in "${expect[@]}"; do
  [[ -s "$root/$f" ]] || fail "not installed: /usr/$f"
done
echo "installed: ${#expect[@]} expected files present under $root"

# The installed man pages must be readable gzip text with a NAME section.
for page in "$root"/share/man/man1/*.1.gz; do
  [[ "$(gzip -dc "$page")" == *$'\n.SH NAME'* ]] || fail "$page is not a man page"
done

cli="$root/bin/gramline-cli"
"$cli" --version | grep -qF "$version" || fail "installed gramline-cli --version does not say $version"
work="$stage/work"
mkdir -p "$work"
"$cli" demo --out "$work/demo.gramline.json" || fail "installed gramline-cli demo exited $?"
[[ -s "$work/demo.gramline.json" ]] || fail "demo wrote no campaign"
"$cli" plan "$work/demo.gramline.json" --out "$work/plan" >"$work/plan.log" ||
  { cat "$work/plan.log" >&2; fail "installed gramline-cli plan exited non-zero"; }
for f in steps.json steps.csv summary.json kernel.csv; do
  [[ -s "$work/plan/$f" ]] || fail "plan --out did not write $f"
done
# steps.csv: a header and one row per step, every row as wide as the header.
awk -F, 'NR == 1 { n = NF; next } NF != n { bad = 1 } END { exit (bad || NR < 2) }' \
  "$work/plan/steps.csv" || fail "steps.csv rows do not match its header"
echo "installed gramline-cli: demo and plan --out wrote the four plan files"

if [[ "$with_app" == ON ]]; then
  # The installed app starts (offscreen) and answers --version with its own version.
  QT_QPA_PLATFORM=offscreen "$root/bin/gramline" --version | grep -qF "$version" ||
    fail "installed gramline --version does not say $version"
  echo "installed gramline: starts and reports $version"
fi
echo "install_staged: OK"
