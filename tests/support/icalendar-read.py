"""Reads an iCalendar file with Python's icalendar (Debian's python3-icalendar) and prints its events as JSON."""
import json
import sys

from icalendar import Calendar

with open(sys.argv[1], "rb") as f:
    calendar = Calendar.from_ical(f.read())

events = []
for event in calendar.walk("VEVENT"):
    start = event.decoded("DTSTART")
    end = event.decoded("DTEND")
    events.append({
        "uid": str(event["UID"]),
        "sequence": int(event.get("SEQUENCE", 0)),
        "status": str(event.get("STATUS", "")),
        "summary": str(event["SUMMARY"]),
        "description": str(event.get("DESCRIPTION", "")),
        "start": start.isoformat(),
        "end": end.isoformat(),
        "tzid": start.tzinfo.zone if getattr(start, "tzinfo", None) is not None and hasattr(start.tzinfo, "zone") else None,
        "stamp": event.decoded("DTSTAMP").isoformat(),
    })
print(json.dumps(events))
