#!/usr/bin/env bash
# package_deb.sh BUILD_DIR VERSION
# Builds the .deb and .tar.gz with CPack into BUILD_DIR/packages and checks them: the .deb holds
# both programs, the desktop entry, the metainfo, the icons, the MIME type and the man pages,
# owned by root; it depends on the Qt runtime packages; the desktop entry and metainfo taken
# out of the package pass desktop-file-validate and appstreamcli validate; the tarball holds
# both programs.
set -euo pipefail
build="$1"
version="$2"
fail() { echo "FAIL: $*" >&2; exit 1; }
for tool in cpack dpkg-deb dpkg-shlibdeps desktop-file-validate appstreamcli file; do
  command -v "$tool" >/dev/null ||
    fail "$tool is missing (packages: dpkg-dev, desktop-file-utils, appstream, file; the quick start installs them)"
done

out="$build/packages"
rm -rf "$out"
mkdir -p "$out"
(cd "$build" && cpack -G "DEB;TGZ" -B "$out" >"$out/cpack.log" 2>&1) ||
  { cat "$out/cpack.log" >&2; fail "cpack failed"; }
debs=("$out"/*.deb)
[[ ${#debs[@]} == 1 && -f "${debs[0]}" ]] || fail "expected one .deb in $out"
deb="${debs[0]}"
echo "built $(basename "$deb") ($(du -h "$deb" | cut -f1))"

info="$(dpkg-deb -I "$deb")"
field() { awk -v f="$1:" '$1 == f { sub(/^ *[^ ]+ /, ""); print }' <<<"$info"; }
[[ "$(field Package)" == gramline ]] || fail "package name is '$(field Package)'"
[[ "$(field Version)" == "$version" ]] || fail "version is '$(field Version)', not $version"
depends="$(field Depends)"
echo "Depends: $depends"
for dep in libqt6core6 libqt6gui6 libqt6widgets6 libqt6charts6 "libquazip1-qt6(-[0-9]+)?" qt6-qpa-plugins; do
  grep -qE "(^|, )$dep( |,|$)" <<<"$depends" || fail "Depends lacks $dep"
done

contents="$(dpkg-deb -c "$deb")"
id=io.github.gramline.Gramline
for f in usr/bin/gramline usr/bin/gramline-cli usr/share/applications/$id.desktop \
         usr/share/metainfo/$id.metainfo.xml usr/share/mime/packages/gramline.xml \
         usr/share/icons/hicolor/scalable/apps/$id.svg \
         usr/share/icons/hicolor/48x48/apps/$id.png usr/share/icons/hicolor/256x256/apps/$id.png \
         usr/share/man/man1/gramline-cli.1.gz usr/share/man/man1/gramline.1.gz \
         usr/share/doc/gramline/README.md; do
  grep -qE " \./$f\$" <<<"$contents" || fail ".deb lacks /$f"
done
# Every entry owned by root, nothing outside /usr.
awk '$2 != "root/root" { bad = 1; print "not root-owned: " $0 } END { exit bad }' <<<"$contents" ||
  fail "files not owned by root"
awk '$6 != "./" && $6 !~ /^\.\/usr(\/|$)/ { bad = 1; print "outside /usr: " $6 } END { exit bad }' \
  <<<"$contents" || fail "files outside /usr"
echo ".deb holds $(grep -c '^-' <<<"$contents") files"

x="$out/extracted"
dpkg-deb -x "$deb" "$x"
for bin in gramline gramline-cli; do
  kind="$(file -b "$x/usr/bin/$bin")"
  [[ "$kind" == ELF*executable* ]] || fail "/usr/bin/$bin is not an executable: $kind"
  [[ "$kind" == *", stripped"* ]] || fail "/usr/bin/$bin is not stripped: $kind"
done
desktop-file-validate "$x/usr/share/applications/$id.desktop" || fail "desktop-file-validate"
echo "desktop-file-validate: OK"
appstreamcli validate --no-net "$x/usr/share/metainfo/$id.metainfo.xml" ||
  fail "appstreamcli validate"
# The packaged CLI runs from the extracted tree (the libraries come from the system).
"$x/usr/bin/gramline-cli" --version | grep -qF "$version" || fail "packaged gramline-cli does not run"

tgzs=("$out"/*.tar.gz)
[[ -f "${tgzs[0]}" ]] || fail "no .tar.gz built"
listing="$(tar -tzf "${tgzs[0]}")"  # a variable, so grep -q cannot cut the pipe short
grep -q '/bin/gramline-cli$' <<<"$listing" || fail ".tar.gz lacks bin/gramline-cli"
grep -q '/bin/gramline$' <<<"$listing" || fail ".tar.gz lacks bin/gramline"
echo "built $(basename "${tgzs[0]}")"
echo "package_deb: OK"
