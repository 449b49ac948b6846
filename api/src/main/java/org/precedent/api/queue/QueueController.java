package org.precedent.api.queue;

import jakarta.validation.Valid;
import java.net.URI;
import java.security.Principal;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.server.ResponseStatusException;

/** The ticket queue: submit a ticket, then read its decision. */
@RestController
class QueueController {
  private final TicketQueue queue;
  private final QueueWorker worker;

  QueueController(TicketQueue queue, QueueWorker worker) {
    this.queue = queue;
    this.worker = worker;
  }

  /**
   * Stores the ticket (committed before this returns) and queues it for a decision: 202 for a new
   * ticket, 200 with the first submission's state for an id seen before.
   */
  @PostMapping(path = "/api/v1/queue/tickets", consumes = MediaType.APPLICATION_JSON_VALUE)
  ResponseEntity<TicketView> submit(@Valid @RequestBody SubmitRequest request, Principal who) {
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
