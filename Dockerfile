# Builds a small image that serves raytable on port 8080 with its store in /data.
FROM golang:1.26-bookworm AS build
WORKDIR /src
COPY go.mod go.sum ./
RUN go mod download
COPY . .
RUN CGO_ENABLED=0 go build -trimpath -ldflags="-s -w" -o /out/raytable ./cmd/raytable && mkdir -p /out/data

FROM gcr.io/distroless/static-debian12:nonroot
COPY --from=build /out/raytable /raytable
# The store directory must belong to the image's non-root user.
COPY --from=build --chown=65532:65532 /out/data /data
VOLUME /data
EXPOSE 8080
ENV RAYTABLE_ADDR=0.0.0.0:8080 RAYTABLE_STORE=/data/raytable.db
ENTRYPOINT ["/raytable"]
CMD ["serve"]
