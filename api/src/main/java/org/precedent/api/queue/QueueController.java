package org.precedent.api.queue;

import jakarta.validation.Valid;
import java.net.URI;
import java.security.Principal;
import org.precedent.api.system.FieldProblem;
import org.precedent.engine.decide.HandOffReason;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.server.ResponseStatusException;

/** The ticket queue: submit a ticket, then read its decision; agents list the queue. */
@RestController
class QueueController {
  private final TicketQueue queue;
  private final QueueWorker worker;
  private final QueueListing listing;

  QueueController(TicketQueue queue, QueueWorker worker, QueueListing listing) {
    this.queue = queue;
    this.worker = worker;
    this.listing = listing;
  }

  /**
   * The queue's tickets, newest first: {@code state} received, replied, handed_off or failed;
   * {@code reason} a hand-off reason; {@code search} text in the ticket id, question or category;
   * {@code page} from 1 and {@code size} up to 100 tickets.
   */
  @GetMapping("/api/v1/queue/tickets")
  QueueListing.Page list(@RequestParam(name = "state", required = false) String state,
      @RequestParam(name = "reason", required = false) String reason,
      @RequestParam(name = "search", required = false) String search,
      @RequestParam(name = "page", required = false) String page,
      @RequestParam(name = "size", required = false) String size) {
    QueueListing.State s = null;
    if (state != null && !state.isBlank()) {
      try {
        s = QueueListing.state(state);
      } catch (IllegalArgumentException e) {
        throw new FieldProblem("state", e.getMessage());
      }
    }
    HandOffReason r = null;
    if (reason != null && !reason.isBlank()) {
      try {
        r = QueueListing.reason(reason);
      } catch (IllegalArgumentException e) {
        throw new FieldProblem("reason", e.getMessage());
      }
    }
    if (search != null && search.length() > QueueListing.SEARCH_CHARS) {
      throw new FieldProblem("search", "must be at most " + QueueListing.SEARCH_CHARS
          + " characters");
    }
    int p = whole("page", page, 1, 1, Integer.MAX_VALUE);
    int n = whole("size", size, 25, 1, QueueListing.MAX_PAGE_SIZE);
    return listing.list(new QueueListing.Filter(s, r, search), p, n);
  }

  private static int whole(String field, String given, int absent, int min, int max) {
    if (given == null || given.isBlank()) {
      return absent;
    }
    try {
      int v = Integer.parseInt(given.strip());
      if (v >= min && v <= max) {
        return v;
      }
    } catch (NumberFormatException e) {
      // said below
    }
    throw new FieldProblem(field, "must be a whole number from " + min + " to " + max);
  }

  /**
   * Stores the ticket (committed before this returns) and queues it for a decision: 202 for a new
   * ticket, 200 with the first submission's state for an id seen before.
   */
  @PostMapping(path = "/api/v1/queue/tickets", consumes = MediaType.APPLICATION_JSON_VALUE)
  ResponseEntity<TicketView> submit(@Valid @RequestBody SubmitRequest request, Principal who) {
    if (request.fields() != null) {
      request.fields().forEach((name, value) -> {
        if (!name.matches("[A-Za-z0-9_.-]{1,100}")) {
          throw new FieldProblem("fields", "field name '" + name + "' may hold only letters, "
              + "digits and _ . - (1 to 100)");
        }
        if (value == null || value.length() > SubmitRequest.FIELD_CHARS) {
          throw new FieldProblem("fields." + name, "must be text of at most "
              + SubmitRequest.FIELD_CHARS + " characters");
        }
      });
    }
    TicketQueue.Submitted s = queue.submit(request, who.getName());
    if (s.created()) {
      worker.wake();
      return ResponseEntity.accepted()
          .location(URI.create("/api/v1/queue/tickets/" + s.ticket().ticketId())).body(s.ticket());
    }
    return ResponseEntity.ok(s.ticket());
  }

  @GetMapping("/api/v1/queue/tickets/{ticketId}")
  TicketView ticket(@PathVariable("ticketId") String ticketId) {
    return queue.find(ticketId).orElseThrow(() -> new ResponseStatusException(
        HttpStatus.NOT_FOUND, "no ticket " + ticketId + " in the queue"));
  }

  @ExceptionHandler(TicketQueue.Conflict.class)
  ProblemDetail conflict(TicketQueue.Conflict e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.CONFLICT, e.getMessage());
    p.setTitle("Ticket already submitted");
    return p;
  }
}
