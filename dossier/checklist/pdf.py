"""Writing the printable checklist to PDF with WeasyPrint (a Python renderer; needs Pango from the system)."""

from __future__ import annotations

import hashlib
import os
from pathlib import Path

SYSTEM_PACKAGES = "libpango-1.0-0 libpangoft2-1.0-0 fonts-dejavu-core"
RENDER_VERSION = "checklist-pdf-1"  # raise when the PDF output changes for the same HTML


class PdfUnavailable(RuntimeError):
    """The PDF renderer cannot run here; the message says what to install."""


def _renderer():
    try:
        import weasyprint
    except (ImportError, OSError) as error:  # OSError: Pango's shared libraries are missing
        raise PdfUnavailable(
            f"cannot write PDF: {error}. Install the Python package 'weasyprint' and, on Debian, "
            f"apt-get install {SYSTEM_PACKAGES}"
        ) from None
    return weasyprint


def no_fetching(weasyprint):
    """The sheet is self-contained: nothing is fetched, not even a file, whatever the HTML names.
    A fetcher that allows no protocol; WeasyPrint warns and leaves the resource out."""
    return weasyprint.urls.URLFetcher(allowed_protocols=())


def write_pdf(html: str, path: Path) -> Path:
    """Render one standalone HTML page to a PDF file; returns the path written."""
    weasyprint = _renderer()
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    weasyprint.HTML(string=html, base_url=str(path.parent), url_fetcher=no_fetching(weasyprint)).write_pdf(str(path))
    return path


class PdfCache:
    """Finished PDFs by the sha256 of their HTML: an unchanged sheet is never rendered twice."""

    def __init__(self, folder: Path | None):
        self.folder = Path(folder) if folder is not None else None  # None: render every time, keep nothing

    def pdf_of(self, html: str) -> bytes:
        if self.folder is None:
            return render_pdf(html)
        key = hashlib.sha256((RENDER_VERSION + html).encode("utf-8")).hexdigest()
        path = self.folder / key[:2] / f"{key}.pdf"
        if path.is_file():
            return path.read_bytes()
        data = render_pdf(html)
        path.parent.mkdir(parents=True, exist_ok=True)
        partial = path.with_suffix(f".{os.getpid()}.part")
        partial.write_bytes(data)
        os.replace(partial, path)
        return data


def render_pdf(html: str) -> bytes:
    """One standalone HTML page as PDF bytes; byte-identical for the same HTML (no creation date)."""
    return _pdf_bytes(_renderer(), html)


def _pdf_bytes(weasyprint, html: str) -> bytes:
    document = weasyprint.HTML(string=html, url_fetcher=no_fetching(weasyprint)).render()
    document.metadata.created = None
    document.metadata.modified = None
    return document.write_pdf()


def pdf_name(build: str, revision: str, paper: str) -> str:
    """'checklist-solar-bank-charger-rev-C-a4.pdf'."""
    return f"checklist-{build}-rev-{revision}-{paper}.pdf"


def write_checklist_pdfs(loaded, findings, folder: Path, commissioning=None) -> dict[str, Path]:
    """The sheet on A4 and on US Letter, for the site build; returns paper -> path."""
    from dossier.checklist.page import PAPER, checklist_html

    record = loaded.record
    return {
        paper: write_pdf(checklist_html(loaded, findings, paper, commissioning), Path(folder) / pdf_name(record.id, record.revision, paper))
        for paper in PAPER
    }
