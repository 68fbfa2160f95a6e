// The kernel's table of string literals already turned into labels.
#pragma once

namespace armature {

// Forgets every literal address remembered by `Label(const char*)`. Called
// before a library whose literals may have been seen is unloaded: another
// library loaded later may put a different text at the same address.
void forget_remembered_literals();

}  // namespace armature
