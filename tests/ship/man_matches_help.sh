#!/usr/bin/env bash
# man_matches_help.sh GRAMLINE_CLI MAN_PAGE
# The man page must describe the command line the program has: every command that
# `gramline-cli --help` lists has a synopsis line and a COMMANDS entry in the man page, every
# option of a command's usage appears in that command's synopsis, and every option of --help
# has an OPTIONS entry. A command or option added to the program without the man page fails.
set -euo pipefail
cli="$1"
page="$2"
fail=0
help_text="$("$cli" --help)"
# The man page with roff escapes undone: "\-\-out" -> "--out".
man_text="$(sed -e 's/\\-/-/g' "$page")"

# Synopsis of each command in the man page: the lines from ".B gramline-cli CMD" to the next
# .br or section.
synopsis() {
  awk -v cmd="$1" '
    /^\.B gramline-cli / { on = ($3 == cmd) ; if (on) print; next }
    /^\.br/ || /^\.SH/ { on = 0 }
    on { print }' <<<"$man_text"
}

commands=$(awk '/^Commands:/ { on = 1; next } /^[^ ]/ { on = 0 }
                on && /^  [a-z]/ { print $1 }' <<<"$help_text")
[[ -n "$commands" ]] || { echo "FAIL: no commands found in --help" >&2; exit 1; }
for cmd in $commands; do
  syn="$(synopsis "$cmd")"
  if [[ -z "$syn" ]]; then
    echo "FAIL: man page has no synopsis for '$cmd'" >&2; fail=1; continue
  fi
  grep -qx "\.B $cmd" <<<"$man_text" ||
    { echo "FAIL: man page COMMANDS has no entry for '$cmd'" >&2; fail=1; }
  usage_line=$(awk -v cmd="$cmd" '/^Commands:/ { on = 1; next } on && $1 == cmd { print; exit }' \
                 <<<"$help_text")
  for opt in $(grep -o -- '--[a-z-]*' <<<"$usage_line" | sort -u); do
    grep -q -- "$opt" <<<"$syn" ||
      { echo "FAIL: '$cmd' takes $opt, the man page synopsis does not show it" >&2; fail=1; }
  done
done

options=$(awk '/^Options:/ { on = 1; next } /^[^ ]/ { on = 0 }
               on && /^  --/ { print $1 }' <<<"$help_text")
options_section=$(awk '/^\.SH OPTIONS/ { on = 1; next } /^\.SH/ { on = 0 } on' <<<"$man_text")
for opt in $options; do
  grep -q -- "^\.BI\? $opt\b" <<<"$options_section" ||
    { echo "FAIL: option $opt of --help has no entry in the man page OPTIONS" >&2; fail=1; }
done
# And the other way: nothing in the man page's OPTIONS that the program does not list.
for opt in $(grep -o -- '^\.BI\? --[a-z-]*' <<<"$options_section" | awk '{ print $2 }'); do
  grep -qx -- "$opt" <<<"$options"$'\n--help' ||
    { echo "FAIL: man page documents $opt, which --help does not list" >&2; fail=1; }
done
((fail == 0)) && echo "man page matches --help: commands $(echo $commands), options $(echo $options)"
exit "$fail"
