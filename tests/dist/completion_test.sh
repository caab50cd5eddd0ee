#!/usr/bin/env bash
# The bash completion offers every command and every flag the program has,
# none it lacks, and the fixed values of flags, for partial words.
#   completion_test.sh BINARY COMPLETION_FILE
set -uo pipefail
binary=$1
source "$(dirname "$0")/help_words.sh"
# shellcheck disable=SC1090
source "$2"
fail=0

# The completions for the command line $1 (the last word is the one being
# completed; end with a space for an empty word).
complete_line() {
  read -r -a COMP_WORDS <<<"$1"
  [[ $1 == *" " ]] && COMP_WORDS+=("")
  COMP_CWORD=$((${#COMP_WORDS[@]} - 1))
  COMPREPLY=()
  _dovetailor
  printf '%s\n' "${COMPREPLY[@]}" | sort -u
}

expect() {  # expect LINE WORD...: every WORD is offered, and nothing else
  local line=$1
  shift
  local got want
  got=$(complete_line "$line")
  want=$(printf '%s\n' "$@" | sort -u)
  if [[ $got != "$want" ]]; then
    echo "completing \"$line\": got [$(echo $got)], expected [$(echo $want)]" >&2
    fail=1
  fi
}

expect "dovetailor ch" check
expect "dovetailor gcode job.toml --po" --post
expect "dovetailor gcode job.toml --coolant m" mist
expect "dovetailor new --type f" female
expect "dovetailor new --units " inch mm
expect "dovetailor sheet job.toml --paper " a4 letter
expect "dovetailor pins --width-at b" bottom
expect "dovetailor trim job.toml --post sm" small-control
expect "dovetailor trim job.toml --reading " # a number: nothing offered

# Every command the program lists, and only those.
expect "dovetailor " $(commands "$binary") --help --version
# Every flag of every command, and only those.
for c in $(commands "$binary"); do
  expect "dovetailor $c -" $(command_flags "$binary" "$c")
done
# Job files for a job argument (run in a folder with one).
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
touch "$work/slide.toml" "$work/slide.ngc"
(cd "$work" && expect "dovetailor plan sl" slide.toml && exit $fail) || fail=1
(cd "$work" && expect "dovetailor check sl" slide.ngc slide.toml && exit $fail) || fail=1
[ $fail -eq 0 ] && echo "completion: all commands and flags offered"
exit $fail
