// Nothing lost: an output file is replaced whole or not at all, even when
// the writing process is killed in the middle.

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <signal.h>
#include <sstream>
#include <string>
#include <sys/wait.h>
#include <unistd.h>

#include <gtest/gtest.h>

#include <dovetailor/base/error.hpp>

#include "../src/cli/file_io.hpp"

namespace dovetailor {
namespace {

namespace fs = std::filesystem;

std::string slurp(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

fs::path fresh_folder(const std::string& name) {
  const fs::path dir = fs::temp_directory_path() / ("dovetailor-atomic-" + name);
  fs::remove_all(dir);
  fs::create_directories(dir);
  return dir;
}

TEST(atomic_write, killed_writer_leaves_the_old_file_intact) {
  const fs::path dir = fresh_folder("kill");
  const fs::path target = dir / "part.ngc";
  std::ofstream(target) << "old program\n";
  int pipe_fds[2];
  ASSERT_EQ(pipe(pipe_fds), 0);
  const pid_t pid = fork();
  ASSERT_GE(pid, 0);
  if (pid == 0) {
    dup2(pipe_fds[1], STDOUT_FILENO);
    execl(DOVETAILOR_PROBE, DOVETAILOR_PROBE, target.c_str(), static_cast<char*>(nullptr));
    _exit(127);
  }
  close(pipe_fds[1]);
  char said[16] = {};
  ASSERT_GT(read(pipe_fds[0], said, sizeof said - 1), 0);  // "writing": a chunk is out
  EXPECT_EQ(std::string(said), "writing\n");
  kill(pid, SIGKILL);
  int status = 0;
  waitpid(pid, &status, 0);
  close(pipe_fds[0]);
  EXPECT_TRUE(WIFSIGNALED(status));
  EXPECT_EQ(slurp(target), "old program\n");
  // The half-written temporary file is beside it, never in its place.
  int temps = 0;
  for (const auto& entry : fs::directory_iterator(dir))
    if (entry.path().filename().string().starts_with(".part.ngc.tmp")) ++temps;
  EXPECT_EQ(temps, 1);
  fs::remove_all(dir);
}

TEST(atomic_write, existing_output_is_refused_without_force) {
  const fs::path dir = fresh_folder("force");
  const fs::path target = dir / "sheet.txt";
  std::ofstream(target) << "keep me";
  EXPECT_THROW(cli::write_file_atomically(target.string(), "new", false), InputError);
  EXPECT_EQ(slurp(target), "keep me");
  cli::write_file_atomically(target.string(), "new", true);
  EXPECT_EQ(slurp(target), "new");
  EXPECT_EQ(std::distance(fs::directory_iterator(dir), fs::directory_iterator()), 1);
  fs::remove_all(dir);
}

TEST(atomic_write, abandoned_write_removes_its_temporary_file) {
  const fs::path dir = fresh_folder("abandon");
  {
    cli::AtomicFile file((dir / "out.svg").string(), false);
    file.write("<svg");
  }  // no commit: as when the writer throws half way
  EXPECT_TRUE(fs::is_empty(dir));
  fs::remove_all(dir);
}

TEST(atomic_write, a_folder_cannot_be_the_output) {
  const fs::path dir = fresh_folder("folder");
  EXPECT_THROW(cli::write_file_atomically(dir.string(), "x", true), InputError);
  fs::remove_all(dir);
}

}  // namespace
}  // namespace dovetailor
