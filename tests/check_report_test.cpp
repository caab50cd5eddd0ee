// The check report's writers: a finding is data (check_result.hpp), and the
// text and JSON writers put it in words in the job's units; findings that
// say the same thing are grouped by their data, not by their words.

#include <string>
#include <vector>

#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include <dovetailor/report/check_report.hpp>

namespace dovetailor {
namespace {

CheckReport report_in(Units units, std::vector<Finding> findings = {}) {
  CheckReport r;
  r.program = "test.ngc";
  r.units = units;
  r.fixtures = {"right vise jaw", "clamp 1", "clamp 2"};
  r.findings = std::move(findings);
  return r;
}

// 25.4 mm to the inch exactly (the inch's definition, 1959).
constexpr double inch = 25.4;

TEST(check_report, each_kind_of_finding_reads_as_a_sentence_in_millimetres) {
  const CheckReport r = report_in(Units::Millimetre);
  const auto text = [&](Finding f) { return finding_text(f, r); };
  using K = FindingKind;
  EXPECT_EQ(text({.kind = K::Gouge, .amount = 3, .limit = 0.01, .tool = 3, .at = Point2{0, -3}}),
            "gouge 3.000 mm deep into the finished part, allowed 0.010 mm; deepest near x = "
            "0.000 mm, z = -3.000 mm");
  EXPECT_EQ(text({.kind = K::StockLeft,
                  .amount = 4.806,
                  .limit = 0.01,
                  .extent = Bounds2{.x_min = -45, .z_min = -5.99, .x_max = 45, .z_max = 0}}),
            "stock left outside the finished part, about 4.806 mm thick, from x = -45.000 mm to "
            "45.000 mm, z = -5.990 mm to 0.000 mm");
  EXPECT_EQ(text({.kind = K::BodyCollision,
                  .amount = 1,
                  .tool = 3,
                  .part = BodyPart::Shank,
                  .at = Point2{30, -1}}),
            "the shank of T3 runs into material about 1.000 mm deep near x = 30.000 mm, z = "
            "-1.000 mm");
  EXPECT_EQ(text({.kind = K::FixtureCollision, .tool = 4, .part = BodyPart::Neck, .fixture = 0}),
            "the neck of T4 runs into right vise jaw");
  // "flutes" is plural: they run.
  EXPECT_EQ(text({.kind = K::FixtureCollision, .tool = 3, .part = BodyPart::Flutes, .fixture = 2}),
            "the flutes of T3 run into clamp 2");
  EXPECT_EQ(text({.kind = K::RapidThroughMaterial, .amount = 2, .tool = 3, .area = 24}),
            "rapid move meets material: 24 mm^2 of it in the tool's path, 2.000 mm high");
  EXPECT_EQ(text({.kind = K::SpindleStopped, .amount = 3, .tool = 3}),
            "feed move into material with the spindle stopped (3.000 mm high)");
  EXPECT_EQ(text({.kind = K::Plunge, .amount = 3, .tool = 4}),
            "dovetail cutter T4 moves down into material (3.000 mm of material); it has no "
            "end-cutting centre and breaks");
  EXPECT_EQ(text({.kind = K::DepthOfCut, .amount = 2, .limit = 10, .tool = 3}),
            "T3 cuts deeper than its flutes are long (10.000 mm): material runs 2.000 mm above "
            "the top of the flutes");
  EXPECT_EQ(text({.kind = K::CutterOverload,
                  .amount = 24.99,
                  .limit = 1.5126,
                  .tool = 4,
                  .overload = Overload::Slot,
                  .on_axis = 2.8726}),
            "dovetail cutter T4 slots through material, engaged across its diameter: a cut "
            "24.990 mm wide with 2.873 mm of material on its axis, where the planner steps it "
            "1.513 mm at a time from one side; it breaks");
  EXPECT_EQ(text({.kind = K::CutterOverload,
                  .amount = 4.5326,
                  .limit = 1.5126,
                  .tool = 4,
                  .overload = Overload::RadialCut}),
            "dovetail cutter T4 takes a radial cut of 4.533 mm; the largest step the planner "
            "takes with it is 1.513 mm");
  EXPECT_EQ(text({.kind = K::RapidBelowSafeHeight, .amount = 4, .limit = 5, .tool = 3}),
            "rapid move over the stock 4.000 mm below the safe height 5.000 mm");
  EXPECT_EQ(text({.kind = K::SpindleSpeed, .amount = 5000, .limit = 3000}),
            "spindle speed 5000 rev/min is above the machine's maximum 3000 rev/min "
            "(machine.max_rpm)");
  EXPECT_EQ(text({.kind = K::NoProgramEnd}), "the program ends without M2, M30 or '%'");
  EXPECT_EQ(text({.kind = K::HomeNotGiven, .home_return = 30}),
            "G30 return with no home position given ([program] g30 or --home G30=X..,Y..,Z..): "
            "taken as straight up from its intermediate point");
  EXPECT_EQ(text({.kind = K::ReadingOutOfTolerance,
                  .amount = 41.747,
                  .limit = 41.647,
                  .band_low = 41.637,
                  .band_high = 41.657,
                  .pin_diameter = 4}),
            "the section reads 41.747 mm against 41.647 mm (41.637 mm to 41.657 mm)");
  EXPECT_EQ(text({.kind = K::ReadingOutOfTolerance,
                  .limit = 41.647,
                  .pin_diameter = 4,
                  .problem = MeasureProblem{MeasureProblemKind::NoFlank, Side::Left}}),
            "the section cannot be read with 4.000 mm pins: no left flank was found between the "
            "floor and the top face");
}

TEST(check_report, an_unknown_tool_finding_says_which_word_named_the_tool) {
  const CheckReport r = report_in(Units::Millimetre);
  const auto text = [&](ToolWord word, int tool) {
    return finding_text({.kind = FindingKind::UnknownTool, .tool = tool, .named_by = word}, r);
  };
  EXPECT_EQ(text(ToolWord::None, 0),
            "moves below the top face with no tool in the spindle (no T and M6 yet): not "
            "simulated");
  EXPECT_EQ(text(ToolWord::T, 9),
            "the program cuts with T9, which the job does not list in [[tool]]: its moves cannot "
            "be checked");
  EXPECT_EQ(text(ToolWord::M6, 9),
            "M6 loads T9, which the job does not list in [[tool]]: its moves cannot be checked");
  EXPECT_EQ(text(ToolWord::D, 7),
            "D7 names T7, which the job does not list in [[tool]]: taken as zero radius; moves "
            "with T7 cannot be checked");
  EXPECT_EQ(text(ToolWord::H, 7),
            "H7 names T7, which the job does not list in [[tool]]: taken as zero length; moves "
            "with T7 cannot be checked");
}

TEST(check_report, a_finding_in_an_inch_job_reads_in_inches) {
  const CheckReport r = report_in(Units::Inch);
  EXPECT_EQ(finding_text({.kind = FindingKind::Gouge,
                          .amount = 0.1 * inch,
                          .limit = 0.0005 * inch,
                          .at = Point2{-0.25 * inch, -0.375 * inch}},
                         r),
            "gouge 0.1000 in deep into the finished part, allowed 0.0005 in; deepest near x = "
            "-0.2500 in, z = -0.3750 in");
  // 1 in^2 = 645.16 mm^2.
  EXPECT_EQ(finding_text({.kind = FindingKind::RapidThroughMaterial,
                          .amount = 0.05 * inch,
                          .area = 0.125 * inch * inch},
                         r),
            "rapid move meets material: 0.125 in^2 of it in the tool's path, 0.0500 in high");
}

TEST(check_report, a_position_a_hair_below_zero_reads_as_zero_not_minus_zero) {
  const CheckReport r = report_in(Units::Millimetre);
  const std::string text =
      finding_text({.kind = FindingKind::Gouge, .amount = 1, .at = Point2{-0.0001, -2}}, r);
  EXPECT_NE(text.find("near x = 0.000 mm, z = -2.000 mm"), std::string::npos) << text;
}

TEST(check_report, a_section_problem_reads_as_words) {
  EXPECT_EQ(measure_problem_text({MeasureProblemKind::NoMaterial}),
            "no material is left in this section");
  EXPECT_EQ(measure_problem_text({MeasureProblemKind::NoFlank, Side::Right}),
            "no right flank was found between the floor and the top face");
  EXPECT_EQ(measure_problem_text({MeasureProblemKind::PinDoesNotFit, Side::Left}),
            "a pin of this size does not fit into the left corner");
}

Finding at_line(Finding f, int line) {
  f.line = line;
  return f;
}

TEST(check_report, findings_that_differ_only_in_their_figures_form_one_group) {
  const Finding gouge{.kind = FindingKind::Gouge, .amount = 1, .tool = 3, .at = Point2{1, -1}};
  Finding deeper = gouge;
  deeper.amount = 2.5;
  deeper.at = Point2{-4, -3};
  deeper.station_y = 80;
  const auto groups = group_findings({at_line(gouge, 9), at_line(deeper, 7), at_line(gouge, 9)});
  ASSERT_EQ(groups.size(), 1u);
  EXPECT_EQ(groups[0].count, 3);
  EXPECT_EQ(groups[0].lines, (std::vector<int>{7, 9}));
  EXPECT_EQ(groups[0].first.amount, 1);  // the first finding stands for the group
  EXPECT_EQ(groups[0].y_min, 80);
}

// Each pair below would share one pattern of words with the figures taken
// out ("T#", "G#", "clamp #"): the group must still tell them apart, or the
// report names one tool, home return or fixture for both.
TEST(check_report, findings_about_different_tools_fixtures_or_returns_are_not_grouped) {
  const Finding fixture{
      .kind = FindingKind::FixtureCollision, .tool = 3, .part = BodyPart::Flutes, .fixture = 1};
  Finding other_fixture = fixture;
  other_fixture.fixture = 2;
  Finding other_tool = fixture;
  other_tool.tool = 4;
  EXPECT_EQ(group_findings({fixture, other_fixture, other_tool, fixture}).size(), 3u);

  const Finding g28{
      .kind = FindingKind::HomeNotGiven, .severity = Severity::Warning, .home_return = 28};
  Finding g30 = g28;
  g30.home_return = 30;
  EXPECT_EQ(group_findings({at_line(g28, 6), at_line(g30, 8)}).size(), 2u);

  const Finding m6{.kind = FindingKind::UnknownTool, .tool = 3, .named_by = ToolWord::M6};
  Finding m6_t4 = m6;
  m6_t4.tool = 4;
  EXPECT_EQ(group_findings({at_line(m6, 3), at_line(m6_t4, 45)}).size(), 2u);

  const Finding neck{.kind = FindingKind::BodyCollision, .tool = 4, .part = BodyPart::Neck};
  Finding shank = neck;
  shank.part = BodyPart::Shank;
  EXPECT_EQ(group_findings({neck, shank}).size(), 2u);

  const Finding slot{.kind = FindingKind::CutterOverload, .tool = 4, .overload = Overload::Slot};
  Finding radial = slot;
  radial.overload = Overload::RadialCut;
  EXPECT_EQ(group_findings({slot, radial}).size(), 2u);
}

TEST(check_report, a_gouge_groups_across_tools_because_its_words_do_not_name_the_tool) {
  const Finding by_t3{.kind = FindingKind::Gouge, .amount = 2, .tool = 3};
  Finding by_t4 = by_t3;
  by_t4.tool = 4;
  EXPECT_EQ(group_findings({at_line(by_t3, 6), at_line(by_t4, 14)}).size(), 1u);
}

TEST(check_report, unreadable_and_out_of_band_sections_are_separate_groups) {
  const Finding reads{.kind = FindingKind::ReadingOutOfTolerance, .amount = 41.7};
  Finding no_left = reads;
  no_left.problem = MeasureProblem{MeasureProblemKind::NoFlank, Side::Left};
  Finding no_right = reads;
  no_right.problem = MeasureProblem{MeasureProblemKind::NoFlank, Side::Right};
  Finding other_reading = reads;
  other_reading.amount = 41.8;
  EXPECT_EQ(group_findings({reads, no_left, no_right, other_reading, no_left}).size(), 3u);
}

TEST(check_report, errors_come_before_warnings) {
  const Finding low{.kind = FindingKind::RapidBelowSafeHeight, .severity = Severity::Warning};
  const Finding gouge{.kind = FindingKind::Gouge};
  const auto groups = group_findings({low, gouge});
  ASSERT_EQ(groups.size(), 2u);
  EXPECT_EQ(groups[0].kind, FindingKind::Gouge);
  EXPECT_EQ(groups[1].kind, FindingKind::RapidBelowSafeHeight);
}

TEST(check_report, the_text_report_shows_each_group_under_its_heading) {
  const Finding g28{.kind = FindingKind::HomeNotGiven,
                    .severity = Severity::Warning,
                    .line = 6,
                    .home_return = 28};
  Finding g30 = g28;
  g30.line = 8;
  g30.home_return = 30;
  CheckReport r = report_in(Units::Millimetre, {g28, g30});
  r.counts = {{FindingKind::HomeNotGiven, 2}};
  const std::string text = format_check_report(r);
  EXPECT_NE(text.find("Findings: 0 errors, 2 warnings (errors first)\n"
                      "  line 6      warning home_not_given\n"
                      "      G28 return with no home position given ([program] g28 or --home\n"
                      "      G28=X..,Y..,Z..): taken as straight up from its intermediate point\n"
                      "  line 8      warning home_not_given\n"
                      "      G30 return"),
            std::string::npos)
      << text;
}

TEST(check_report, the_json_finding_carries_its_data_and_its_words) {
  CheckReport r = report_in(Units::Inch);
  r.findings = {{.kind = FindingKind::BodyCollision,
                 .line = 14,
                 .station_y = 2 * inch,
                 .amount = 0.01 * inch,
                 .tool = 4,
                 .part = BodyPart::Neck,
                 .at = Point2{0.5 * inch, -0.02 * inch}},
                {.kind = FindingKind::FixtureCollision,
                 .line = 5,
                 .tool = 3,
                 .part = BodyPart::Flutes,
                 .fixture = 1},
                {.kind = FindingKind::ReadingOutOfTolerance,
                 .line = 30,
                 .station_y = 1 * inch,
                 .limit = 1.5 * inch,
                 .band_low = 1.499 * inch,
                 .band_high = 1.501 * inch,
                 .pin_diameter = 0.25 * inch,
                 .problem = MeasureProblem{MeasureProblemKind::PinDoesNotFit, Side::Right}},
                {.kind = FindingKind::UnknownTool,
                 .line = 4,
                 .amount = 7,
                 .tool = 7,
                 .named_by = ToolWord::H}};
  const auto j = nlohmann::json::parse(check_json(r));
  const auto& body = j["findings"][0];
  EXPECT_EQ(body["kind"], "body_collision");
  EXPECT_EQ(body["part"], "neck");
  EXPECT_EQ(body["tool"], 4);
  EXPECT_DOUBLE_EQ(body["x"].get<double>(), 0.5);
  EXPECT_DOUBLE_EQ(body["z"].get<double>(), -0.02);
  EXPECT_DOUBLE_EQ(body["amount"].get<double>(), 0.01);
  EXPECT_DOUBLE_EQ(body["station_y"].get<double>(), 2);
  EXPECT_EQ(body["text"], finding_text(r.findings[0], r));
  EXPECT_FALSE(body.contains("fixture"));
  const auto& fixture = j["findings"][1];
  EXPECT_EQ(fixture["fixture"], "clamp 1");
  EXPECT_EQ(fixture["fixture_index"], 1);
  EXPECT_EQ(fixture["part"], "flutes");
  EXPECT_EQ(fixture["text"], "the flutes of T3 run into clamp 1");
  const auto& reading = j["findings"][2];
  EXPECT_DOUBLE_EQ(reading["band"][0].get<double>(), 1.499);
  EXPECT_DOUBLE_EQ(reading["band"][1].get<double>(), 1.501);
  EXPECT_DOUBLE_EQ(reading["pin_diameter"].get<double>(), 0.25);
  EXPECT_EQ(reading["problem"]["kind"], "pin_does_not_fit");
  EXPECT_EQ(reading["problem"]["side"], "right");
  const auto& unknown = j["findings"][3];
  EXPECT_EQ(unknown["named_by"], "h");
  EXPECT_EQ(unknown["tool"], 7);
  EXPECT_EQ(unknown["text"], finding_text(r.findings[3], r));
  ASSERT_EQ(j["finding_groups"].size(), 4u);
  EXPECT_EQ(j["finding_groups"][1]["text"], "the flutes of T3 run into clamp 1");
}

}  // namespace
}  // namespace dovetailor
