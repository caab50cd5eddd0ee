#pragma once

#include <string>

#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/report/sheet.hpp>

namespace dovetailor {

// The pass sheet as plain text, every line at most 80 columns (ASCII only, so
// it prints on any printer and reads in any terminal): the title block, the
// cautions, the set-up steps, one table per operation with the checkpoints
// boxed in after their pass, then the legend and notes. A cell too wide for
// its column is wrapped inside the column, never cut off.
std::string sheet_text(const Sheet& sheet);

}  // namespace dovetailor
