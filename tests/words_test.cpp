#include <set>
#include <string>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include <dovetailor/base/units.hpp>
#include <dovetailor/base/words.hpp>
#include <dovetailor/check/check_words.hpp>
#include <dovetailor/gcode/gcode_words.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/plan/plan.hpp>
#include <dovetailor/rs274/rs274_events.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

// Every row's key reads back as its value, keys and values are each used
// once, and the table has a row for each of the enum's `count` values.
template <class E>
void expect_round_trip(std::size_t count) {
  std::set<std::string_view> keys;
  std::set<E> values;
  for (const auto& w : word_table(E{})) {
    SCOPED_TRACE(std::string(w.key));
    EXPECT_FALSE(w.key.empty());
    EXPECT_EQ(from_key<E>(w.key), w.value);
    EXPECT_EQ(key_of(w.value), w.key);
    EXPECT_FALSE(text_of(w.value).empty());
    keys.insert(w.key);
    values.insert(w.value);
  }
  EXPECT_EQ(keys.size(), count);
  EXPECT_EQ(values.size(), count);
}

TEST(words, every_file_key_round_trips) {
  expect_round_trip<Units>(2);
  expect_round_trip<DovetailType>(2);
  expect_round_trip<WidthAt>(2);
  expect_round_trip<AngledSides>(3);
  expect_round_trip<Ends>(3);
  expect_round_trip<Side>(2);
  expect_round_trip<ToolKind>(4);
  expect_round_trip<ToolMaterial>(2);
  expect_round_trip<MachineKind>(2);
  expect_round_trip<MillingMode>(3);
  expect_round_trip<CheckpointAt>(3);
  expect_round_trip<XDatumMethod>(2);
  expect_round_trip<FixtureKind>(3);
  expect_round_trip<SlideAxis>(4);
  expect_round_trip<AxisDirection>(2);
  expect_round_trip<CommonDial>(4);
  expect_round_trip<ReadingMethod>(3);
  expect_round_trip<CoolantChoice>(3);
  expect_round_trip<FindingKind>(15);
  expect_round_trip<Severity>(2);
  expect_round_trip<ToolWord>(5);
  expect_round_trip<Overload>(2);
  expect_round_trip<PassRole>(4);
  expect_round_trip<EndKind>(4);
}

TEST(words, unknown_key_reads_as_nothing) {
  EXPECT_EQ(from_key<DovetailType>("Male"), std::nullopt);  // keys are lower case
  EXPECT_EQ(from_key<Ends>(""), std::nullopt);
}

TEST(words, key_list_names_every_key) {
  EXPECT_EQ(key_list<Ends>(), "\"open\", \"front-open\", \"closed\"");
  EXPECT_EQ(key_list<Ends>("or"), "\"open\", \"front-open\" or \"closed\"");
  EXPECT_EQ(key_list<Units>("or"), "\"inch\" or \"mm\"");
}

// The job reader takes its keys from the same tables: a job file written
// with each key of a table reads back as that value.
TEST(words, job_reader_reads_every_key_of_its_tables) {
  const std::string job = testing::read_source_file("samples/fixture-slide-female.toml");
  const auto with = [&](const std::string& from, const std::string& to) {
    const auto at = job.find(from);
    EXPECT_NE(at, std::string::npos) << from;
    std::string text = job;
    return read_job(text.replace(at, from.size(), to), "words.toml");
  };
  for (const auto& w : word_table(Ends{}))
    EXPECT_EQ(with("ends = \"open\"", fmt::format("ends = \"{}\"", w.key)).dovetail.ends, w.value);
  for (const auto& w : word_table(ToolMaterial{}))
    EXPECT_EQ(
        with("material = \"hss\"", fmt::format("material = \"{}\"", w.key)).tools.at(1).material,
        w.value);
}

}  // namespace
}  // namespace dovetailor
