# Sourced by the dist tests: what the program itself says it has.
#   commands BINARY         the subcommands listed by `BINARY --help`
#   command_flags BINARY C  every flag of `BINARY C --help`, one a line

commands() {
  "$1" --help | awk '/^Subcommands:/ { on = 1; next } on && /^  [a-z]/ { print $1 }'
}

command_flags() {
  "$1" "$2" --help | awk '/^  -/ { print $1 }' | tr ',' '\n' | sort -u
}
