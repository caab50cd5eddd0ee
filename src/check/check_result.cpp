#include <algorithm>

#include <dovetailor/check/check_result.hpp>
#include <dovetailor/check/check_words.hpp>

namespace dovetailor {

std::string_view finding_kind_name(FindingKind kind) { return key_of(kind); }

std::string_view tool_word_name(ToolWord word) { return key_of(word); }

std::string_view overload_name(Overload overload) { return key_of(overload); }

std::string_view severity_name(Severity severity) { return key_of(severity); }

bool CheckReport::has_errors() const {
  return std::any_of(findings.begin(), findings.end(),
                     [](const Finding& f) { return f.severity == Severity::Error; });
}

long CheckReport::count(FindingKind kind) const {
  for (const FindingCount& c : counts)
    if (c.kind == kind) return c.count;
  return 0;
}

}  // namespace dovetailor
