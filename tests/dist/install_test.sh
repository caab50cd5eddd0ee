#!/usr/bin/env bash
# `cmake --install` into a fresh prefix outside the build folder, then the
# installed tree checked (installed_check.sh).
#   install_test.sh BUILD_DIR SOURCE_DIR
set -euo pipefail
build=$1 source=$2
prefix=$(mktemp -d "${TMPDIR:-/tmp}/dovetailor-install.XXXXXX")
prefix=$(cd "$prefix" && pwd -P)  # as the binary sees itself, links resolved
trap 'rm -rf "$prefix"' EXIT
cmake --install "$build" --prefix "$prefix" >/dev/null
source "$(dirname "$0")/installed_check.sh"
check_installed "$prefix" "$source"
