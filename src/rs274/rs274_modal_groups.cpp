#include "rs274_modal_groups.hpp"

#include <fmt/format.h>

namespace dovetailor::detail {

// Modal groups of G codes (NISTIR 6556 table 4 "Modal groups", from
// memory). Codes are times ten. -1: not an RS-274/NGC code; -2: an
// RS-274/NGC code the checker does not simulate.
int g_group(int code) {
  switch (code) {
    case 0:
    case 10:
    case 20:
    case 30:
    case 800:
    case 810:
    case 820:
    case 830:
    case 850:
    case 890:
      return 1;
    case 170:
    case 180:
    case 190:
      return 2;
    case 900:
    case 910:
      return 3;
    case 930:
    case 940:
      return 5;
    case 200:
    case 210:
      return 6;
    case 400:
    case 410:
    case 420:
      return 7;
    case 430:
    case 490:
      return 8;
    case 980:
    case 990:
      return 10;
    case 540:
    case 550:
    case 560:
    case 570:
    case 580:
    case 590:
    case 591:
    case 592:
    case 593:
      return 12;
    case 610:
    case 611:
    case 640:
      return 13;
    case 40:
    case 100:
    case 280:
    case 300:
    case 530:
    case 920:
    case 921:
    case 922:
    case 923:
      return 0;
    case 382:
    case 840:
    case 860:
    case 870:
    case 880:
      return -2;
    default:
      return -1;
  }
}

// M code groups (same table): 4 stopping, 6 tool change, 7 spindle,
// 8 coolant, 9 override switches.
int m_group(int code) {
  switch (code) {
    case 0:
    case 1:
    case 2:
    case 30:
    case 60:
      return 4;
    case 6:
      return 6;
    case 3:
    case 4:
    case 5:
      return 7;
    case 7:
    case 8:
    case 9:
      return 8;
    case 48:
    case 49:
      return 9;
    default:
      return -1;
  }
}

std::string g_name(int code) {
  return code % 10 ? fmt::format("G{}.{}", code / 10, code % 10) : fmt::format("G{}", code / 10);
}

std::string m_name(int code) { return fmt::format("M{}", code); }

}  // namespace dovetailor::detail
