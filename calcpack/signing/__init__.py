"""Keys, signatures by role and verification of calc packages."""
