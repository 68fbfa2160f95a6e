// Numbers and bar arrangements as the calculation record, the CLI summary
// and the codes' derivation steps print them: one way, everywhere.
#pragma once

#include <string>

namespace armature {

// A number in plain notation to four significant figures, trailing zeros
// dropped: 8000, 125000, 0.006637, 1, 0.0051, -12.5. Never an exponent for
// magnitudes from 1e-12 to 1e15 (everything a slab record meets); outside
// that range "%.4g" is kept rather than a string of zeros. A value no
// larger in magnitude than 1e-9 × `scale` prints as 0: rounding noise such
// as 3.725e-15 kNm beside moments of tens of kNm (pass the largest value of
// the quantity printed beside it as `scale`; the default suits quantities
// of order 1 and above). Infinity prints as "inf", not-a-number as "-".
std::string plain_number(double v, double scale = 1.0);

// A bar arrangement: "ø12 @ 175 mm" for bars named by their diameter in mm
// (a designation that starts with a digit), "#4 @ 300 mm" for bars named by
// a catalogue; the spacing in `unit`, given in that unit.
std::string bar_arrangement(const std::string& bar, double spacing, const std::string& unit = "mm");

}  // namespace armature
