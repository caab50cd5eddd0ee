#include "app.hpp"

int main(int argc, char** argv) { return dovetailor::cli::run_cli(argc, argv); }
