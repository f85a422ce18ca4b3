//! The accept loop: one task per connection, with the limits a public
//! endpoint needs against slow or idle clients.
//!
//! - a **header-read timeout**: a request's head must arrive whole within
//!   it, so a client sending one byte a second cannot hold a connection;
//! - an **idle timeout**: a connection with no request in progress that
//!   moves no bytes for this long is closed, so silent connections do not
//!   pile up;
//! - a **cap on open connections**: past it a connection is answered with
//!   a JSON 503 and closed at once (and a rate-limited WARN says so),
//!   which keeps the process under its file limit and leaves room for
//!   clients that behave;
//! - a **bounded drain**: on shutdown the listener closes, every
//!   connection is asked to finish its request and close, and whatever is
//!   left after the drain timeout is dropped, so a half-sent header cannot
//!   stall a rolling deploy.

use std::convert::Infallible;
use std::future::Future;
use std::io;
use std::net::SocketAddr;
use std::pin::Pin;
use std::sync::atomic::{AtomicU64, AtomicUsize, Ordering};
use std::sync::Arc;
use std::task::{Context, Poll};
use std::time::Duration;

use axum::extract::ConnectInfo;
use axum::Router;
use hyper::body::Incoming;
use hyper::server::conn::http1;
use hyper_util::rt::{TokioIo, TokioTimer};
use tokio::io::{AsyncRead, AsyncWrite, ReadBuf};
use tokio::net::{TcpListener, TcpStream};
use tokio::sync::{watch, Semaphore};
use tokio::task::JoinSet;
use tokio::time::Instant;
use tower::ServiceExt;

use crate::log_gate::LogGate;

/// Limits on connections. [`Limits::default`] is what `tidings serve`
/// uses unless told otherwise.
#[derive(Debug, Clone)]
pub struct Limits {
    /// How long a request's head (request line and headers) may take to
    /// arrive, from when the server starts waiting for it. The server
    /// starts waiting for the next head as soon as a response has gone, so
    /// this also bounds the idle time between requests.
    pub header_read_timeout: Duration,
    /// How long a connection with no request in progress may stay silent.
    pub idle_timeout: Duration,
    /// Most connections open at once; more are refused.
    pub max_connections: usize,
    /// How long shutdown waits for open connections to finish.
    pub drain_timeout: Duration,
}

impl Default for Limits {
    fn default() -> Limits {
        Limits {
            header_read_timeout: Duration::from_secs(10),
            idle_timeout: Duration::from_secs(5),
            // Well under the usual file limit of 1,024, which the process
            // also needs for Redis, logs and the data files.
            max_connections: 512,
            drain_timeout: Duration::from_secs(10),
        }
    }
}

/// Largest request head hyper buffers. Past it hyper itself answers 431;
/// the service's own, smaller header limit (with a JSON body) is checked
/// in the router.
const MAX_HEAD_BUFFER: usize = 64 * 1024;

/// What a refused connection is sent before it is closed: the service's
/// error shape, so even this refusal is JSON.
const REFUSAL: &[u8] = b"HTTP/1.1 503 Service Unavailable\r\n\
content-type: application/json\r\n\
retry-after: 1\r\n\
connection: close\r\n\
content-length: 102\r\n\r\n\
{\"error\":{\"code\":\"too_many_connections\",\"message\":\"the server is at its connection limit; try again\"}}";

/// Serves `router` on `listener` within `limits` until `shutdown`
/// completes, then drains. Fails only if the listener cannot be read at
/// all; errors on single connections are logged at debug and dropped.
pub async fn serve(
    listener: TcpListener,
    router: Router,
    limits: Limits,
    shutdown: impl Future<Output = ()> + Send + 'static,
) -> io::Result<()> {
    // The semaphore counts open connections: a permit lives as long as its
    // connection's task, so the count cannot drift.
    let permits = Arc::new(Semaphore::new(limits.max_connections.max(1)));
    let (stop_tx, stop_rx) = watch::channel(false);
    let mut conns = JoinSet::new();
    let mut refused = LogGate::new(Duration::from_secs(10));
    let mut accept_errors = LogGate::new(Duration::from_secs(10));
    tokio::pin!(shutdown);
    loop {
        tokio::select! {
            _ = &mut shutdown => break,
            // Reap finished connections so the set does not grow.
            Some(_) = conns.join_next(), if !conns.is_empty() => {}
            accepted = listener.accept() => match accepted {
                Ok((stream, peer)) => match Arc::clone(&permits).try_acquire_owned() {
                    Ok(permit) => {
                        let router = router.clone();
                        let limits = limits.clone();
                        let stop = stop_rx.clone();
                        conns.spawn(async move {
                            connection(stream, peer, router, &limits, stop).await;
                            drop(permit);
                        });
                    }
                    Err(_) => {
                        if let Some(suppressed) = refused.pass() {
                            tracing::warn!(
                                limit = limits.max_connections,
                                refused_since_last = suppressed + 1,
                                "connection limit reached; refusing new connections"
                            );
                        }
                        // Best effort and never waiting: a client that does
                        // not read gets a closed socket instead.
                        let _ = stream.try_write(REFUSAL);
                    }
                },
                Err(e) => {
                    // Typically the file limit (EMFILE). Pause so a
                    // persistent error does not spin the loop.
                    if let Some(suppressed) = accept_errors.pass() {
                        tracing::warn!(error = %e, errors_since_last = suppressed + 1, "cannot accept a connection");
                    }
                    tokio::time::sleep(Duration::from_millis(50)).await;
                }
            }
        }
    }
    drop(listener);
    let _ = stop_tx.send(true);
    let open = conns.len();
    let drained = tokio::time::timeout(limits.drain_timeout, async {
        while conns.join_next().await.is_some() {}
    })
    .await;
    match drained {
        Ok(()) => tracing::info!(connections = open, "drained"),
        Err(_) => {
            tracing::warn!(
                left = conns.len(),
                drain_timeout_s = limits.drain_timeout.as_secs_f64(),
                "drain timed out; closing the connections left"
            );
            conns.abort_all();
        }
    }
    Ok(())
}

/// Serves one connection until it ends, goes idle or the server stops.
async fn connection(
    stream: TcpStream,
    peer: SocketAddr,
    router: Router,
    limits: &Limits,
    mut stop: watch::Receiver<bool>,
) {
    let activity = Arc::new(Activity::new());
    let io = TokioIo::new(Tracked {
        inner: stream,
        activity: Arc::clone(&activity),
    });
    let in_service = Arc::clone(&activity);
    let service = hyper::service::service_fn(move |mut req: hyper::Request<Incoming>| {
        // Handlers that limit by source address read it from here.
        req.extensions_mut().insert(ConnectInfo(peer));
        let busy = in_service.begin();
        let router = router.clone();
        async move {
            let response = router.oneshot(req).await;
            drop(busy);
            Ok::<_, Infallible>(response.unwrap_or_else(|e| match e {}))
        }
    });
    let mut builder = http1::Builder::new();
    builder
        .timer(TokioTimer::new())
        .header_read_timeout(limits.header_read_timeout)
        .max_buf_size(MAX_HEAD_BUFFER);
    let conn = builder.serve_connection(io, service);
    tokio::pin!(conn);
    let mut closing = false;
    loop {
        let idle_at = activity.idle_deadline(limits.idle_timeout);
        tokio::select! {
            done = conn.as_mut() => {
                if let Err(e) = done {
                    tracing::debug!(error = %e, "connection ended with an error");
                }
                return;
            }
            _ = stop.changed(), if !closing => {
                closing = true;
                conn.as_mut().graceful_shutdown();
            }
            _ = tokio::time::sleep_until(idle_at), if !closing => {
                if activity.idle_for(limits.idle_timeout) {
                    closing = true;
                    conn.as_mut().graceful_shutdown();
                }
            }
        }
    }
}

/// When a connection last moved bytes and how many of its requests are in
/// progress. Shared by the connection's reader, its service and its
/// watchdog, hence atomics behind an `Arc`.
struct Activity {
    start: Instant,
    /// Milliseconds from `start` to the last byte read or written.
    last_ms: AtomicU64,
    in_flight: AtomicUsize,
}

impl Activity {
    fn new() -> Activity {
        Activity {
            start: Instant::now(),
            last_ms: AtomicU64::new(0),
            in_flight: AtomicUsize::new(0),
        }
    }

    fn touch(&self) {
        let ms = self.start.elapsed().as_millis() as u64;
        self.last_ms.store(ms, Ordering::Relaxed);
    }

    /// Marks a request in progress until the guard is dropped.
    fn begin(self: &Arc<Self>) -> Busy {
        self.in_flight.fetch_add(1, Ordering::Relaxed);
        Busy(Arc::clone(self))
    }

    /// When the connection will have been idle for `idle`, if nothing
    /// happens; while a request is in progress, one `idle` from now (to
    /// look again then).
    fn idle_deadline(&self, idle: Duration) -> Instant {
        if self.in_flight.load(Ordering::Relaxed) > 0 {
            return Instant::now() + idle;
        }
        self.start + Duration::from_millis(self.last_ms.load(Ordering::Relaxed)) + idle
    }

    fn idle_for(&self, idle: Duration) -> bool {
        self.in_flight.load(Ordering::Relaxed) == 0
            && self.start.elapsed()
                >= Duration::from_millis(self.last_ms.load(Ordering::Relaxed)) + idle
    }
}

/// A request in progress on a connection.
struct Busy(Arc<Activity>);

impl Drop for Busy {
    fn drop(&mut self) {
        self.0.touch();
        self.0.in_flight.fetch_sub(1, Ordering::Relaxed);
    }
}

/// A socket that notes when bytes move, for the idle timeout.
struct Tracked {
    inner: TcpStream,
    activity: Arc<Activity>,
}

impl AsyncRead for Tracked {
    fn poll_read(
        mut self: Pin<&mut Self>,
        cx: &mut Context<'_>,
        buf: &mut ReadBuf<'_>,
    ) -> Poll<io::Result<()>> {
        let before = buf.filled().len();
        let r = Pin::new(&mut self.inner).poll_read(cx, buf);
        if buf.filled().len() > before {
            self.activity.touch();
        }
        r
    }
}

impl AsyncWrite for Tracked {
    fn poll_write(
        mut self: Pin<&mut Self>,
        cx: &mut Context<'_>,
        buf: &[u8],
    ) -> Poll<io::Result<usize>> {
        let r = Pin::new(&mut self.inner).poll_write(cx, buf);
        if matches!(r, Poll::Ready(Ok(n)) if n > 0) {
            self.activity.touch();
        }
        r
    }

    fn poll_flush(mut self: Pin<&mut Self>, cx: &mut Context<'_>) -> Poll<io::Result<()>> {
        Pin::new(&mut self.inner).poll_flush(cx)
    }

    fn poll_shutdown(mut self: Pin<&mut Self>, cx: &mut Context<'_>) -> Poll<io::Result<()>> {
        Pin::new(&mut self.inner).poll_shutdown(cx)
    }

    fn poll_write_vectored(
        mut self: Pin<&mut Self>,
        cx: &mut Context<'_>,
        bufs: &[io::IoSlice<'_>],
    ) -> Poll<io::Result<usize>> {
        let r = Pin::new(&mut self.inner).poll_write_vectored(cx, bufs);
        if matches!(r, Poll::Ready(Ok(n)) if n > 0) {
            self.activity.touch();
        }
        r
    }

    fn is_write_vectored(&self) -> bool {
        self.inner.is_write_vectored()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_refusal_is_json_of_the_length_it_declares() {
        let text = std::str::from_utf8(REFUSAL).unwrap();
        let (head, body) = text.split_once("\r\n\r\n").unwrap();
        assert!(head.contains(&format!("content-length: {}", body.len())));
        let v: serde_json::Value = serde_json::from_str(body).unwrap();
        assert_eq!(v["error"]["code"], "too_many_connections");
    }
}
