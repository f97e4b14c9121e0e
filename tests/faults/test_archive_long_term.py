"""Fault injection: a signed package still verifies ten years on (issue 15, point 3).

The validation clock is moved ten years ahead, past the signers' certificates (30 days) and,
in one case, past the first timestamp authority's. The timestamps come from pyHanko's test
timestamp authority (a general-purpose reference library), run locally. What must hold is the
PAdES long-term rule (ETSI EN 319 142-1, baseline levels B-LT and B-LTA, from memory): a
certificate is checked at the time a timestamp proves, and a chain of document timestamps
carries that proof forward as long as it is renewed before its newest certificate expires.
"""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path
from typing import Any

import pytest

from calcpack.cli import main
from calcpack.errors import InputError
from calcpack.signing.longterm import renew_timestamp
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package
from tests.unit.signing.signing_helpers import (
    attach_manifest,
    cover_pdf,
    make_manifest,
    make_timestamp_authority,
)

NOW = dt.datetime.now(dt.UTC)
TEN_YEARS = NOW + dt.timedelta(days=3653)


@pytest.fixture(scope="module")
def demo(tmp_path_factory: pytest.TempPathFactory) -> Any:
    from calcpack.signing.keys import make_demo_credentials

    return make_demo_credentials(tmp_path_factory.mktemp("keys"), days=30)


@pytest.fixture(scope="module")
def blank(tmp_path_factory: pytest.TempPathFactory) -> Path:
    path = tmp_path_factory.mktemp("blank") / "package.pdf"
    path.write_bytes(attach_manifest(cover_pdf(), make_manifest()))
    return path


@pytest.fixture
def package(blank: Path, tmp_path: Path) -> Path:
    target = tmp_path / "package.pdf"
    shutil.copy(blank, target)
    return target


def _sign_two(package: Path, demo: Any, stamper: Any = None) -> None:
    for role in ("preparer", "checker"):
        sign_package(package, role, demo.keys[role], demo.password, timestamper=stamper)


def test_ten_years_ahead_a_timestamped_package_verifies(
    package: Path, demo: Any, tmp_path: Path
) -> None:
    stamper, tsa_root = make_timestamp_authority(tmp_path, days=20 * 365)
    _sign_two(package, demo, stamper)
    report = verify_package(package, [demo.root, tsa_root], now=TEN_YEARS)
    assert report.ok, report.text()
    assert len(report.timestamps) == 2  # one document timestamp after each signature (B-LTA)
    for sig in report.signatures:
        assert sig.time_basis == "the time its signature timestamp proves"
        assert sig.checked_at is not None
        assert abs(sig.checked_at - NOW) < dt.timedelta(hours=1)
    # the same package, checked today, says the same
    assert verify_package(package, [demo.root, tsa_root]).ok


def test_signatures_embed_their_validation_data(package: Path, demo: Any) -> None:
    """PAdES B-LT: the chain is in the document security store, even with no timestamp."""
    import io

    from pyhanko.pdf_utils.reader import PdfFileReader

    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    reader = PdfFileReader(io.BytesIO(package.read_bytes()))
    dss = reader.root["/DSS"]
    assert len(dss["/Certs"]) >= 2  # the signer's certificate and the demo root


def test_ten_years_ahead_without_a_timestamp_fails_unless_at_signing_time(
    package: Path, demo: Any
) -> None:
    _sign_two(package, demo)
    later = verify_package(package, [demo.root], now=TEN_YEARS)
    assert not later.ok
    for sig in later.signatures:
        assert not sig.trusted
        assert "--at signing-time" in sig.trust
        assert sig.time_basis == "now (no timestamp proves the signing time)"
    claimed = verify_package(package, [demo.root], now=TEN_YEARS, at="signing-time")
    assert claimed.ok, claimed.text()
    for sig in claimed.signatures:
        assert sig.time_basis == "the signing time the signer claims (no timestamp proves it)"
    assert "the signer claims" in claimed.text()
    dated = verify_package(package, [demo.root], now=TEN_YEARS, at=NOW + dt.timedelta(days=1))
    assert dated.ok
    assert dated.signatures[0].time_basis == "the date asked for (--at)"


def test_verify_at_from_the_command_line(
    package: Path, demo: Any, capsys: pytest.CaptureFixture[str]
) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    trust = ["--trust", str(demo.root)]
    assert main(["verify", str(package), *trust, "--at", "signing-time"]) == 0
    assert "the signer claims" in capsys.readouterr().out
    assert main(["verify", str(package), *trust, "--at", f"{NOW:%Y-%m-%d}T23:59"]) == 0
    assert main(["verify", str(package), *trust, "--at", "2037-01-01"]) == 1  # demo key expired
    assert main(["verify", str(package), *trust, "--at", "next week"]) == 1
    assert "--at 'next week'" in capsys.readouterr().err
    with pytest.raises(InputError, match="at = 'yesterday'"):
        verify_package(package, [demo.root], at="yesterday")


def test_a_renewed_timestamp_carries_the_proof_past_the_first_authority(
    package: Path, demo: Any, tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    first, first_root = make_timestamp_authority(tmp_path / "a", days=5 * 365, name="First TSA")
    _sign_two(package, demo, first)
    trust = [demo.root, first_root]
    unrenewed = verify_package(package, trust, now=TEN_YEARS)
    assert not unrenewed.ok  # the first authority's certificate has expired by then
    assert any("renew" in p for p in unrenewed.problems)
    renewal = NOW + dt.timedelta(days=4 * 365)  # renewed in year four, before it expired
    second, second_root = make_timestamp_authority(
        tmp_path / "b", days=20 * 365, name="Second TSA", fixed_dt=renewal
    )
    before = package.read_bytes()
    result = renew_timestamp(package, timestamper=second, trust=(first_root,))
    assert package.read_bytes().startswith(before)  # an incremental update
    assert result.previous == 2
    assert result.time == renewal
    renewed = verify_package(package, [*trust, second_root], now=TEN_YEARS)
    assert renewed.ok, renewed.text()
    assert [t.valid for t in renewed.timestamps] == [True, True, True]
    # without a server the command refuses in one line
    assert main(["renew-timestamp", str(package)]) == 1
    assert "needs a timestamp server" in capsys.readouterr().err


def test_renewing_an_unsigned_package_is_refused(package: Path, tmp_path: Path) -> None:
    from calcpack.errors import SigningError

    stamper, _ = make_timestamp_authority(tmp_path, days=365)
    with pytest.raises(SigningError, match="carries no signature"):
        renew_timestamp(package, timestamper=stamper)
