"""Job file (TOML) → validated model. See :func:`load_job`."""

from .load import load_job, load_text

__all__ = ["load_job", "load_text"]
