// The readable summary of a design, as the CLI prints it.
#pragma once

#include <string>

#include "armature/design.hpp"

namespace armature {

std::string format_summary(const DesignRecord& record);

}  // namespace armature
