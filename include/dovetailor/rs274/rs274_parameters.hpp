#pragma once

#include <vector>

namespace dovetailor {

// The numbered parameters #1 .. #5399 of RS-274/NGC (NIST RS274NGC
// Interpreter Version 3, NISTIR 6556, section 3.2.1 "Parameters", from
// memory). Every parameter starts at 0. Storage is fixed at construction
// (at most 5400 doubles) and never grows with the program.
//
// Parameters the interpreter reads (NISTIR 6556 table "Parameters used",
// from memory): #5221-#5226 G54 origin X Y Z A B C, then blocks of 20 for
// G55 (#5241..) to G59.3 (#5381..); #5161-#5163 and #5181-#5183 are the
// G28 and G30 home positions; #5211-#5213 the G92 offsets; #5220 the
// number of the selected system (1 = G54). Values are in the program's
// length units.
class Rs274Parameters {
 public:
  static constexpr int highest_number = 5399;

  // `highest` lowers the accepted range (a control with fewer parameters);
  // it is clamped to 1 .. 5399.
  explicit Rs274Parameters(int highest = highest_number);

  int highest() const { return static_cast<int>(values_.size()) - 1; }
  bool valid(int number) const { return number >= 1 && number <= highest(); }
  // Both assert `valid(number)`; the reader checks numbers from a program.
  double get(int number) const;
  void set(int number, double value);

 private:
  std::vector<double> values_;
};

}  // namespace dovetailor
