#include <algorithm>
#include <numeric>

#include <cairo-pdf.h>
#include <fmt/format.h>

#include <dovetailor/render/cairo_render.hpp>
#include <dovetailor/report/sheet_text.hpp>

#include "cairo_handles.hpp"
#include "scene_painter.hpp"

namespace dovetailor {
namespace {

// Points (1/72 in) throughout this file.
constexpr double body = 8.5;  // font size
constexpr double leading = 1.3;
constexpr double pad = 3;  // inside table cells
constexpr double pt_per_mm = 72 / 25.4;

struct Page {
  double width, height, margin = 42;
  double left() const { return margin; }
  double right() const { return width - margin; }
  double content() const { return width - 2 * margin; }
  double bottom() const { return height - margin - 14; }  // room for the footer
};

class SheetWriter {
 public:
  SheetWriter(const Sheet& sheet, Page page, cairo_t* cr) : sheet_(sheet), page_(page), cr_(cr) {
    y_ = page_.margin;
  }

  void font(double size, bool bold = false) {
    cairo_select_font_face(cr_, detail::font_family, CAIRO_FONT_SLANT_NORMAL,
                           bold ? CAIRO_FONT_WEIGHT_BOLD : CAIRO_FONT_WEIGHT_NORMAL);
    cairo_set_font_size(cr_, size);
  }
  double width_of(const std::string& text) {
    cairo_text_extents_t e;
    cairo_text_extents(cr_, text.c_str(), &e);
    return e.x_advance;
  }
  // Lines of `text` that fit `width` in the current font; a word wider than
  // the width is set smaller on its own line by show().
  std::vector<std::string> wrap(const std::string& text, double width) {
    std::vector<std::string> lines;
    std::string row;
    for (const auto& word : wrap_words(text, 1)) {
      const std::string trial = row.empty() ? word : row + " " + word;
      if (!row.empty() && width_of(trial) > width) {
        lines.push_back(row);
        row = word;
      } else {
        row = trial;
      }
    }
    lines.push_back(row);
    return lines;
  }
  void show(double x, double baseline, const std::string& text, double max_width,
            bool right = false) {
    double w = width_of(text);
    cairo_save(cr_);
    if (w > max_width && w > 0) {
      const double shrink = max_width / w;
      cairo_matrix_t m;
      cairo_get_font_matrix(cr_, &m);
      cairo_matrix_scale(&m, shrink, shrink);
      cairo_set_font_matrix(cr_, &m);
      w = max_width;
    }
    cairo_move_to(cr_, right ? x + max_width - w : x, baseline);
    cairo_set_source_rgb(cr_, 0, 0, 0);
    cairo_show_text(cr_, text.c_str());
    cairo_restore(cr_);
  }
  void rect(double x, double y, double w, double h, double grey, bool fill, double line = 0.5) {
    cairo_rectangle(cr_, x, y, w, h);
    cairo_set_source_rgb(cr_, grey, grey, grey);
    if (fill) {
      cairo_fill(cr_);
    } else {
      cairo_set_line_width(cr_, line);
      cairo_stroke(cr_);
    }
  }

  void new_page() {
    footer();
    cairo_show_page(cr_);
    ++page_number_;
    y_ = page_.margin;
  }
  void ensure(double h) {
    if (y_ + h > page_.bottom() && y_ > page_.margin + 1) new_page();
  }
  void footer() {
    font(7);
    show(page_.left(), page_.height - page_.margin + 4,
         fmt::format("{} - page {}", sheet_.title, page_number_), page_.content());
  }

  void paragraph(const std::string& text, double x, double width, double size = body,
                 bool bold = false) {
    font(size, bold);
    for (const auto& line : wrap(text, width)) {
      ensure(size * leading);
      y_ += size * leading;
      show(x, y_ - size * 0.3, line, width);
    }
  }

  void title_block() {
    paragraph(sheet_.title, page_.left(), page_.content(), 15, true);
    y_ += 4;
    font(body, true);
    double label = 0;
    for (const auto& f : sheet_.facts) label = std::max(label, width_of(f.label));
    label += 2 * pad;
    const double top = y_;
    for (const auto& f : sheet_.facts) {
      font(body);
      const auto lines = wrap(f.value, page_.content() - label - 2 * pad);
      const double h = static_cast<double>(lines.size()) * body * leading + 2 * pad;
      rect(page_.left(), y_, label, h, 0.92, true);
      font(body, true);
      show(page_.left() + pad, y_ + pad + body, f.label, label - 2 * pad);
      font(body);
      double base = y_ + pad + body;
      for (const auto& l : lines) {
        show(page_.left() + label + pad, base, l, page_.content() - label - 2 * pad);
        base += body * leading;
      }
      y_ += h;
      cairo_move_to(cr_, page_.left(), y_);
      cairo_line_to(cr_, page_.right(), y_);
      cairo_set_source_rgb(cr_, 0.6, 0.6, 0.6);
      cairo_set_line_width(cr_, 0.4);
      cairo_stroke(cr_);
    }
    rect(page_.left(), top, page_.content(), y_ - top, 0, false, 0.8);
  }

  void block(const SheetBlock& b) {
    if (b.items.empty()) return;
    y_ += 8;
    const double x = page_.left() + (b.caution ? 8 : 0);
    const double w = page_.content() - (b.caution ? 16 : 0);
    ensure(40);
    const double top = y_;
    if (b.caution) y_ += 4;
    paragraph(b.caution ? "CAUTION" : b.heading, x, w, 11, true);
    y_ += 2;
    int n = 0;
    for (const auto& item : b.items) {
      const std::string mark = b.numbered ? fmt::format("{}.", ++n) : b.caution ? "!" : "-";
      font(body, b.caution);
      const double before = y_;
      paragraph(item, x + 16, w - 16);
      font(body, true);
      if (y_ > before) show(x, before + body * leading - body * 0.3, mark, 14);
      y_ += 2;
    }
    if (b.caution && y_ > top) {
      y_ += 3;
      rect(page_.left(), top, page_.content(), y_ - top, 0, false, 1.6);
    }
  }

  // A table with cell borders; returns its height without drawing when
  // `draw` is false. Columns get their measured width; when they do not fit,
  // the widest left-aligned columns give way and wrap.
  std::vector<double> column_widths(const std::vector<SheetColumn>& columns,
                                    const std::vector<std::vector<std::string>>& rows,
                                    double width) {
    std::vector<double> w(columns.size(), 0);
    for (std::size_t c = 0; c < columns.size(); ++c) {
      font(body, true);
      w[c] = width_of(columns[c].heading) + 2 * pad;
      font(body);
      for (const auto& r : rows)
        if (c < r.size()) w[c] = std::max(w[c], width_of(r[c]) + 2 * pad);
      if (columns[c].kind == ColumnKind::Tick) w[c] = std::max(w[c], 24.0);
    }
    double total = std::accumulate(w.begin(), w.end(), 0.0);
    while (total > width + 0.01) {
      std::size_t widest = w.size();
      for (std::size_t c = 0; c < w.size(); ++c)
        if (columns[c].align == CellAlign::Left && w[c] > 40 &&
            (widest == w.size() || w[c] > w[widest]))
          widest = c;
      if (widest == w.size()) break;
      const double give = std::min(total - width, w[widest] - 40);
      w[widest] -= give;
      total -= give;
    }
    // Spread what is left over the columns so tables end flush.
    if (total < width)
      for (auto& c : w) c *= width / total;
    return w;
  }

  double row(const std::vector<SheetColumn>& columns, const std::vector<double>& w,
             const std::vector<std::string>& cells, double x, bool heading, bool draw) {
    font(body, heading);
    std::vector<std::vector<std::string>> lines(columns.size());
    std::size_t most = 1;
    for (std::size_t c = 0; c < columns.size(); ++c) {
      lines[c] = wrap(c < cells.size() ? cells[c] : "", w[c] - 2 * pad);
      most = std::max(most, lines[c].size());
    }
    const double h = static_cast<double>(most) * body * leading + 2 * pad;
    if (!draw) return h;
    if (heading) rect(x, y_, std::accumulate(w.begin(), w.end(), 0.0), h, 0.88, true);
    double cx = x;
    for (std::size_t c = 0; c < columns.size(); ++c) {
      rect(cx, y_, w[c], h, 0.45, false, 0.4);
      if (!heading && columns[c].kind == ColumnKind::Tick) {
        rect(cx + w[c] / 2 - 5, y_ + h / 2 - 5, 10, 10, 0, false, 0.8);
      } else {
        font(body, heading);
        double base = y_ + pad + body;
        for (const auto& l : lines[c]) {
          show(cx + pad, base, l, w[c] - 2 * pad, columns[c].align == CellAlign::Right);
          base += body * leading;
        }
      }
      cx += w[c];
    }
    y_ += h;
    return h;
  }

  void checkpoint(const CheckpointBox& box, double x, double width) {
    // Measure first so the box stays on one page.
    const double inner = width - 16;
    font(body);
    double h = 24;
    for (const auto& l : box.lines)
      h += static_cast<double>(wrap(l, inner).size()) * body * leading;
    std::vector<double> w;
    if (!box.measured_label.empty()) {
      h += 34 + 14;
      w = column_widths(box.corrections.columns, box.corrections.rows, inner);
      h += row(box.corrections.columns, w, {}, x, true, false);
      for (const auto& r : box.corrections.rows)
        h += row(box.corrections.columns, w, r, x, false, false);
    }
    ensure(h + 6);
    y_ += 3;
    const double top = y_;
    rect(x, top, width, 15, 0.2, true);
    font(9.5, true);
    cairo_save(cr_);
    cairo_move_to(cr_, x + 6, top + 11);
    cairo_set_source_rgb(cr_, 1, 1, 1);
    cairo_show_text(cr_, box.title.c_str());
    cairo_restore(cr_);
    y_ = top + 17;
    for (const auto& l : box.lines) paragraph(l, x + 8, inner);
    if (!box.measured_label.empty()) {
      y_ += 6;
      font(body, true);
      show(x + 8, y_ + 16, box.measured_label + ":", 140);
      rect(x + 8 + width_of(box.measured_label + ":") + 8, y_ + 2, 110, 20, 0, false, 0.8);
      y_ += 28;
      paragraph("If you read:", x + 8, inner, body, true);
      y_ += 2;
      row(
          box.corrections.columns, w,
          [&] {
            std::vector<std::string> head;
            for (const auto& c : box.corrections.columns) head.push_back(c.heading);
            return head;
          }(),
          x + 8, true, true);
      for (const auto& r : box.corrections.rows)
        row(box.corrections.columns, w, r, x + 8, false, true);
    }
    y_ += 6;
    rect(x, top, width, y_ - top, 0, false, 1.6);
    y_ += 3;
  }

  void operation(const OperationTable& op) {
    y_ += 10;
    ensure(80);
    paragraph(op.title, page_.left(), page_.content(), 11, true);
    for (const auto& l : op.intro) paragraph(l, page_.left() + 8, page_.content() - 8);
    y_ += 4;
    std::vector<std::vector<std::string>> passes;
    for (const auto& r : op.rows)
      if (!r.checkpoint) passes.push_back(r.cells);
    const auto w = column_widths(op.columns, passes, page_.content());
    std::vector<std::string> head;
    for (const auto& c : op.columns) head.push_back(c.heading);
    const auto heading = [&] { row(op.columns, w, head, page_.left(), true, true); };
    heading();
    for (const auto& r : op.rows) {
      if (r.checkpoint) {
        checkpoint(*r.checkpoint, page_.left(), page_.content());
        continue;
      }
      const double h = row(op.columns, w, r.cells, page_.left(), false, false);
      if (y_ + h > page_.bottom()) {
        new_page();
        heading();
      }
      row(op.columns, w, r.cells, page_.left(), false, true);
    }
  }

  void drawing(const Drawing& d) {
    new_page();
    const double w_mm = page_.content() / pt_per_mm;
    const double h_mm = std::min(w_mm * 1.05, (page_.bottom() - y_) / pt_per_mm);
    const Scene scene = layout_drawing(d, w_mm, h_mm);
    cairo_save(cr_);
    cairo_translate(cr_, page_.left(), y_);
    cairo_scale(cr_, pt_per_mm, pt_per_mm);
    detail::paint_scene(cr_, scene);
    cairo_restore(cr_);
    y_ += h_mm * pt_per_mm;
    new_page();
  }

  void finish() {
    footer();
    cairo_show_page(cr_);
  }

 private:
  const Sheet& sheet_;
  Page page_;
  cairo_t* cr_;
  double y_ = 0;
  int page_number_ = 1;
};

}  // namespace

std::string sheet_pdf(const Sheet& sheet, const Drawing* drawing, Paper paper) {
  const Page page = paper == Paper::A4 ? Page{595.28, 841.89} : Page{612, 792};
  const std::string what = "PDF pass sheet";
  std::string bytes;
  auto surface = detail::own_surface(
      cairo_pdf_surface_create_for_stream(detail::append_bytes, &bytes, page.width, page.height),
      what);
  cairo_pdf_surface_set_metadata(surface.get(), CAIRO_PDF_METADATA_TITLE, sheet.title.c_str());
  auto cr = detail::make_context(surface.get(), what);
  {
    SheetWriter w(sheet, page, cr.get());
    w.title_block();
    w.block(sheet.cautions);
    w.block(sheet.setup);
    if (drawing) w.drawing(*drawing);
    for (const auto& op : sheet.operations) w.operation(op);
    w.block(sheet.legend);
    w.block(sheet.notes);
    w.finish();
  }
  detail::finish_surface(cr, surface, what);
  return bytes;
}

}  // namespace dovetailor
