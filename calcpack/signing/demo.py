"""Signing the demo package: demo credentials made on the spot, preparer and checker sign.

``calcpack demo`` calls :func:`after_build_sign` on the build result (it is one of the demo's
after-build steps). The password of the demo keys is random and lives only in memory, so the key
files are removed once the package is signed; the demo root certificate stays in ``DIR/keys`` so
that the package can be verified with
``calcpack verify PACKAGE --trust DIR/keys/demo-root.crt``.
"""

from __future__ import annotations

import os
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import SigningError

__all__ = ["DemoSignoff", "after_build_sign", "sign_demo_package"]

DEMO_ROLES = ("preparer", "checker")


@dataclass(frozen=True)
class DemoSignoff:
    """The signed demo package and what verifies it.

    Attributes:
        pdf: the package, signed as preparer and checker.
        root: the demo root certificate to trust when verifying.
        reused: the package was already signed by an earlier demo run and left as it was.
    """

    pdf: Path
    root: Path
    reused: bool = False

    @property
    def verify_command(self) -> str:
        """The command line that verifies the package."""
        return f"calcpack verify {self.pdf} --trust {self.root}"


def sign_demo_package(
    pdf: str | os.PathLike[str],
    folder: str | os.PathLike[str],
    *,
    project: str | os.PathLike[str] | None = None,
) -> DemoSignoff:
    """Sign a freshly built demo package as preparer and checker with demo credentials.

    The signer names and firm come from the package's manifest (the project's people), so the
    stamps agree with the cover. A package already signed by a previous run is kept if it
    verifies against the demo root in ``folder/keys``.

    Args:
        pdf: the built package (signed in place, atomically).
        folder: the demo folder; keys go to ``folder/keys``.
        project: the demo project directory (for the review file; default ``folder/project``).

    Raises:
        SigningError: the package carries signatures that the demo root does not verify.
    """
    from calcpack.signing.keys import make_demo_credentials
    from calcpack.signing.manifest import load_manifest
    from calcpack.signing.sign import sign_package
    from calcpack.signing.verify import verify_package

    pdf_path = Path(pdf)
    keys = Path(folder) / "keys"
    root = keys / "demo-root.crt"
    project_dir = Path(project) if project is not None else Path(folder) / "project"
    if root.is_file():
        earlier = verify_package(pdf_path, [root])
        if earlier.signatures:
            signed = [s.role for s in earlier.signatures]
            if earlier.ok and signed == list(DEMO_ROLES):
                return DemoSignoff(pdf=pdf_path, root=root, reused=True)
            raise SigningError(
                f"The demo package {str(pdf_path)!r} carries signatures the demo root does not "
                "verify; delete the demo folder and run `calcpack demo` again"
            )
    manifest = load_manifest(pdf_path)
    info = manifest.get("project") or {}
    people = {
        role: str(info[role]) for role in ("preparer", "checker", "approver") if info.get(role)
    }
    firm = str(info.get("firm") or "Demo Engineering Practice")
    creds = make_demo_credentials(keys, firm=firm, people=people)
    try:
        for role in DEMO_ROLES:
            sign_package(
                pdf_path,
                role,
                creds.keys[role],
                creds.password,
                reason="Demonstration signature -- not for construction",
                project=project_dir if project_dir.is_dir() else None,
            )
    finally:
        # Nobody knows their password (it was never shown): key files nobody can open are
        # clutter at best, so only the root certificate stays, for verifying.
        for key_file in creds.keys.values():
            key_file.unlink(missing_ok=True)
    return DemoSignoff(pdf=pdf_path, root=creds.root)


def after_build_sign(result: Any, folder: Path, args: Any) -> None:
    """The demo's after-build step: sign ``result.pdf_path`` and say how to verify it."""
    signoff = sign_demo_package(result.pdf_path, folder)
    state = "already signed" if signoff.reused else "signed"
    print(f"Package {state} as preparer and checker with demo certificates.")
    print(f"Verify it with: {signoff.verify_command}")
