"""calcreport: calculation reports for built-up structural members and their connector spacing."""

__version__ = "0.1.0"
