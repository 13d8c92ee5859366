//! (filled by its issue; see DEVELOPERS.md for the module plan)
