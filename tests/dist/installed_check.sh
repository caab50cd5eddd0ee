# Sourced by install_test.sh and .ci/package: checks an installed tree.
#   check_installed PREFIX SOURCE_DIR
# The binary, the posts, the man page and the completion are where
# GNUInstallDirs puts them; the installed binary plans a sample, writes a
# program through a shipped post, and finds its posts in PREFIX only (its
# message for a missing post lists the folders it searched).

check_installed() {
  local prefix=$1 source=$2 ok=0 exe=$1/bin/dovetailor
  local f
  for f in bin/dovetailor share/dovetailor/post/rs274ngc-full.toml \
    share/dovetailor/post/small-control.toml share/dovetailor/post/iso6983-numbered.toml \
    share/dovetailor/post/README.md share/man/man1/dovetailor.1.gz \
    share/bash-completion/completions/dovetailor; do
    [ -e "$prefix/$f" ] || { echo "not installed: $prefix/$f" >&2; ok=1; }
  done
  [ $ok -eq 0 ] || return 1
  local out message
  out=$("$exe" plan "$source/samples/fixture-slide-female.toml") && [[ $out == "Cutting plan: "* ]] ||
    { echo "installed binary: plan failed" >&2; return 1; }
  out=$("$exe" gcode "$source/samples/stop-block-male.toml" --post rs274ngc-full) &&
    [[ $out == *$'\nM2' ]] || { echo "installed binary: gcode --post rs274ngc-full failed" >&2; return 1; }
  message=$("$exe" gcode "$source/samples/stop-block-male.toml" --post no-such-post 2>&1) && return 1
  local expected="no post \"no-such-post\" in $prefix/share/dovetailor/post;"
  if [[ $message != *"$expected"* ]]; then
    echo "installed binary searches other folders than $prefix/share/dovetailor/post:" >&2
    echo "$message" >&2
    return 1
  fi
  # The completion and the man page as installed.
  bash -c "source '$prefix/share/bash-completion/completions/dovetailor' && complete -p dovetailor" \
    >/dev/null || { echo "the installed completion does not register" >&2; return 1; }
  gzip -dc "$prefix/share/man/man1/dovetailor.1.gz" | grep -q "^\.SH EXIT STATUS" ||
    { echo "the installed man page is not readable" >&2; return 1; }
  echo "installed in $prefix: binary, posts (found there), man page, completion"
}
