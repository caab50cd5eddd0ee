// Test helper for tests/atomic_write_test.cpp: writes TARGET through
// AtomicFile in 1 MiB chunks, slowly, saying "writing" once the first chunk
// is out, so the test can kill it in the middle of the write.

#include <chrono>
#include <cstdio>
#include <string>
#include <thread>

#include "../src/cli/file_io.hpp"

int main(int argc, char** argv) {
  if (argc != 2) return 2;
  dovetailor::cli::AtomicFile file(argv[1], true);
  const std::string chunk(1 << 20, 'n');
  file.write(chunk);
  std::puts("writing");
  std::fflush(stdout);
  for (int i = 0; i < 600; ++i) {
    file.write(chunk);
    std::this_thread::sleep_for(std::chrono::milliseconds(50));
  }
  file.commit();
  return 0;
}
