#include <algorithm>
#include <numeric>

#include <fmt/format.h>

#include <dovetailor/report/sheet_text.hpp>

namespace dovetailor {
namespace {

constexpr std::size_t page_width = 80;

// Text lines of a table `width` columns wide: columns two spaces apart; when
// the natural widths do not fit, the widest left-aligned columns give way and
// their cells wrap.
struct TableText {
  std::vector<std::string> head;               // heading line(s) and the rule under them
  std::vector<std::vector<std::string>> rows;  // the lines of each row

  std::vector<std::string> all() const {
    std::vector<std::string> lines = head;
    for (const auto& r : rows) lines.insert(lines.end(), r.begin(), r.end());
    return lines;
  }
};

TableText table_lines(const std::vector<SheetColumn>& columns,
                      const std::vector<std::vector<std::string>>& rows, std::size_t width) {
  const std::size_t n = columns.size();
  std::vector<std::size_t> w(n, 1);
  for (std::size_t c = 0; c < n; ++c) {
    w[c] = std::max(w[c], columns[c].heading.size());
    for (const auto& row : rows)
      if (c < row.size()) w[c] = std::max(w[c], row[c].size());
  }
  const std::size_t gaps = 2 * (n - 1);
  auto total = [&] { return std::accumulate(w.begin(), w.end(), gaps); };
  while (total() > width) {
    std::size_t widest = n;
    for (std::size_t c = 0; c < n; ++c)
      if (columns[c].align == CellAlign::Left && w[c] > 8 && (widest == n || w[c] > w[widest]))
        widest = c;
    if (widest == n) break;  // nothing left to give: the caller's table is too wide
    --w[widest];
  }
  const auto emit = [&](const std::vector<std::string>& cells) {
    std::vector<std::string> out;
    std::vector<std::vector<std::string>> wrapped(n);
    std::size_t height = 1;
    for (std::size_t c = 0; c < n; ++c) {
      wrapped[c] = wrap_words(c < cells.size() ? cells[c] : "", w[c]);
      height = std::max(height, wrapped[c].size());
    }
    for (std::size_t line = 0; line < height; ++line) {
      std::string text;
      for (std::size_t c = 0; c < n; ++c) {
        const std::string cell = line < wrapped[c].size() ? wrapped[c][line] : "";
        if (c) text += "  ";
        text += columns[c].align == CellAlign::Right ? fmt::format("{:>{}}", cell, w[c])
                                                     : fmt::format("{:<{}}", cell, w[c]);
      }
      while (!text.empty() && text.back() == ' ') text.pop_back();
      out.push_back(text);
    }
    return out;
  };
  TableText table;
  std::vector<std::string> heading;
  heading.reserve(columns.size());
  for (const auto& c : columns) heading.push_back(c.heading);
  table.head = emit(heading);
  std::string rule;
  for (std::size_t c = 0; c < n; ++c) rule += (c ? "  " : "") + std::string(w[c], '-');
  table.head.push_back(rule);
  for (const auto& row : rows) table.rows.push_back(emit(row));
  return table;
}

void add_block(std::string& out, const SheetBlock& block) {
  if (block.items.empty()) return;
  std::string heading = block.heading;
  std::transform(heading.begin(), heading.end(), heading.begin(),
                 [](unsigned char ch) { return static_cast<char>(std::toupper(ch)); });
  out += "\n" + heading + "\n";
  int number = 0;
  for (const auto& item : block.items) {
    const std::string mark = block.numbered  ? fmt::format("{}. ", ++number)
                             : block.caution ? "! "
                                             : "- ";
    const std::string first = "  " + mark;
    const std::string rest(first.size(), ' ');
    bool first_line = true;
    for (const auto& line : wrap_words(item, page_width - first.size())) {
      out += (first_line ? first : rest) + line + "\n";
      first_line = false;
    }
  }
}

void add_checkpoint(std::string& out, const CheckpointBox& box) {
  const std::size_t inner = page_width - 6;  // "  | " ... " |"
  const auto framed = [&](const std::string& text) {
    out += fmt::format("  | {:<{}} |\n", text, inner);
  };
  const std::string top = "  +== " + box.title + " ";
  out += top + std::string(page_width - 1 - top.size(), '=') + "+\n";
  for (const auto& line : box.lines)
    for (const auto& l : wrap_words(line, inner)) framed(l);
  if (!box.measured_label.empty()) {
    framed("");
    framed(box.measured_label + ":  ______________");
    framed("");
    framed("If you read:");
    for (const auto& l : table_lines(box.corrections.columns, box.corrections.rows, inner).all())
      framed(l);
  }
  out += "  +" + std::string(page_width - 4, '-') + "+\n";
}

}  // namespace

std::string sheet_text(const Sheet& sheet) {
  std::string out = sheet.title + "\n" + std::string(page_width, '=') + "\n";
  std::size_t label = 0;
  for (const auto& f : sheet.facts) label = std::max(label, f.label.size());
  for (const auto& f : sheet.facts) {
    bool first = true;
    for (const auto& line : wrap_words(f.value, page_width - label - 2)) {
      out += fmt::format("{:<{}}  {}\n", first ? f.label : "", label, line);
      first = false;
    }
  }
  add_block(out, sheet.cautions);
  add_block(out, sheet.setup);
  for (const auto& op : sheet.operations) {
    out += "\n" + op.title + "\n" + std::string(op.title.size(), '-') + "\n";
    for (const auto& line : op.intro)
      for (const auto& l : wrap_words(line, page_width - 2)) out += "  " + l + "\n";
    out += "\n";
    // Pass rows are laid out together so their columns line up across the
    // checkpoint boxes between them.
    std::vector<std::vector<std::string>> passes;
    for (const auto& row : op.rows)
      if (!row.checkpoint) passes.push_back(row.cells);
    const auto table = table_lines(op.columns, passes, page_width - 2);
    for (const auto& l : table.head) out += "  " + l + "\n";
    std::size_t pass_index = 0;
    for (const auto& row : op.rows) {
      if (row.checkpoint) {
        add_checkpoint(out, *row.checkpoint);
        continue;
      }
      for (const auto& l : table.rows[pass_index]) out += "  " + l + "\n";
      ++pass_index;
    }
  }
  add_block(out, sheet.legend);
  add_block(out, sheet.notes);
  return out;
}

}  // namespace dovetailor
