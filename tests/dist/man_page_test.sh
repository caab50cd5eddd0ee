#!/usr/bin/env bash
# The man page formats without a warning (groff -ww), and names every
# command and every flag the program has.
#   man_page_test.sh BINARY MAN_PAGE
set -uo pipefail
binary=$1 page=$2
source "$(dirname "$0")/help_words.sh"
fail=0
if command -v groff >/dev/null; then
  warnings=$(groff -man -Tutf8 -ww -z "$page" 2>&1)
  if [[ -n $warnings ]]; then
    echo "groff warnings:" >&2
    echo "$warnings" >&2
    fail=1
  fi
else
  echo "groff not found (Debian groff-base): formatting not checked" >&2
  exit 77
fi
# The roff source with its escapes for - undone.
text=$(sed 's/\\-/-/g' "$page")
for c in $(commands "$binary"); do
  grep -qx "\.B $c" <<<"$text" || { echo "no entry \".B $c\" under COMMANDS" >&2; fail=1; }
  for f in $(command_flags "$binary" "$c"); do
    [[ $f == -h || $f == --help ]] && continue
    grep -qE -- "(^|[^a-z-])$f([^a-z-]|\$)" <<<"$text" ||
      { echo "$c: flag $f is not in the man page" >&2; fail=1; }
  done
done
for section in NAME SYNOPSIS DESCRIPTION COMMANDS CAUTIONS "EXIT STATUS" FILES; do
  grep -q "^\.SH \"\?$section\"\?\$" "$page" || { echo "no section $section" >&2; fail=1; }
done
[ $fail -eq 0 ] && echo "man page: formats cleanly, every command and flag described"
exit $fail
